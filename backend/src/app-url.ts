import { config } from './config';

let baseUrl = config.appUrl ?? `http://127.0.0.1:${config.port}`;

/**
 * The public address used in e-mailed links. It comes from configuration (APP_URL) or the
 * address the server is listening on — never from a request's Host header, which a caller controls.
 */
export function appUrl(pathAndQuery = ''): string {
  return `${baseUrl.replace(/\/$/, '')}${pathAndQuery}`;
}

export function setListeningAddress(url: string): void {
  if (!config.appUrl) baseUrl = url;
}
