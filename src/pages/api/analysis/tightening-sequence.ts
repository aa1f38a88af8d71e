import { CALCULATIONS, calculationEndpoint } from '../../../lib/server/calculations';

/** `?bolts=N` (3–36) → `{ bolts, sequence }`, the cross order for bolts numbered clockwise from 1. */
export const GET = calculationEndpoint(CALCULATIONS.tighteningSequence);
