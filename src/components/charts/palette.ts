/**
 * The palette of global.css as plain values: SVG presentation attributes cannot read CSS variables,
 * and the CSP forbids inline style attributes. Keep in step with the @theme block.
 */
export const PALETTE = {
  paper: '#fbfaf6',
  panel: '#ffffff',
  ink: '#15181c',
  inkSoft: '#3d444d',
  rule: '#c9c4b8',
  petrol: '#0d4a5c',
  petrolWash: '#dcecef',
  amber: '#8a4b00',
  amberWash: '#fbebd2',
  alarm: '#9e1b1b',
  steady: '#1d5e2c',
} as const;
