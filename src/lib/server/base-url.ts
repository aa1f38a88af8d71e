import { readEnvironment } from '../../environment';

/** Where links in e-mail point: PUBLIC_URL when set, otherwise the address this request came to. */
export function resolveBaseUrl(requestUrl: URL): string {
  return (readEnvironment().PUBLIC_URL ?? requestUrl.origin).replace(/\/$/, '');
}
