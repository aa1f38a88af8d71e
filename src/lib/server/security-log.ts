/**
 * Security events — sign-ins, failed sign-ins, sign-outs, denied requests — as one JSON line each on stdout,
 * with who, what and when (UTC). Never a password, token or cookie.
 */
export function logSecurityEvent(event: string, details: Record<string, string | number | undefined | null>): void {
  const line = { at: new Date().toISOString(), event, ...details };
  console.log(`[lashline:security] ${JSON.stringify(line)}`);
}
