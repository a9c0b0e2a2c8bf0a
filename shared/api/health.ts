/** `GET /api/health`: whether the API and its database answer. 200 when up, 503 when not. */
export interface HealthReport {
  status: 'ok' | 'degraded';
  database: 'up' | 'down';
  version: string;
}
