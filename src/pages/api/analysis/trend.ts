import { CALCULATIONS, calculationEndpoint } from '../../../lib/server/calculations';

/** `{ points: [{ runs, value }], limit? }` → the fitted line and where it meets the limit. */
export const POST = calculationEndpoint(CALCULATIONS.trend);
