import { readEnvironment } from '../../environment';

/** The demo accounts the seed makes; listed on the sign-in page only while LASHLINE_DEMO is on. */
export const DEMO_PASSWORD = 'lashline-demo';
export const DEMO_ACCOUNTS = [
  { email: 'owner@lashline.test', name: 'Marguerite Okafor-Lind', role: 'owner' },
  { email: 'chief@lashline.test', name: 'Teodor Vashti', role: 'crew-chief' },
  { email: 'tech@lashline.test', name: 'Ines Calloway', role: 'technician' },
  { email: 'viewer@lashline.test', name: 'Rune Abernathy', role: 'viewer' },
] as const;

export function isDemoOn(): boolean {
  return readEnvironment().LASHLINE_DEMO === 'on';
}
