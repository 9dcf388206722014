import type { AppConfig } from '../config/config.js';

/** Links in e-mails: PUBLIC_URL when set, else the app's own origin. */
export function appOrigin(config: AppConfig): string {
  return (config.PUBLIC_URL ?? `http://${config.HOST}:${config.PORT}`).replace(/\/$/, '');
}

export const inspectionLink = (config: AppConfig, id: string) => `${appOrigin(config)}/inspections/${id}`;
export const findingLink = (config: AppConfig, id: string) => `${appOrigin(config)}/findings/${id}`;
