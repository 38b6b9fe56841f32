import { env } from '../../../config/env';

// Plain links: the browser downloads them with the session cookie (GET needs no CSRF token).
export const fittedModelUrl = (fitRunId: string) => `${env.apiBaseUrl}/fit-runs/${encodeURIComponent(fitRunId)}/fitted-model`;
export const residualsCsvUrl = (fitRunId: string) => `${env.apiBaseUrl}/fit-runs/${encodeURIComponent(fitRunId)}/residuals?format=csv`;
