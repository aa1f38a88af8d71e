import { CALCULATIONS, calculationEndpoint } from '../../../lib/server/calculations';

/** `{ unit, readings, profile?, ringTeeth?, pinionTeeth?, pressureAngleDeg? }` → statistics, fit, verdicts. */
export const POST = calculationEndpoint(CALCULATIONS.backlash);
