// Types for scripts/lib/s3-fake.mjs (plain JavaScript so the set-up scripts run before npm ci).
export interface S3Fake {
  endpoint: string;
  port: number;
  pid: number;
  stop(): Promise<void>;
}
export function s3FakeEnv(endpoint: string, bucket: string, prefix?: string): Record<string, string>;
export function startS3Fake(dir: string, buckets: string[], options?: { port?: number }): Promise<S3Fake>;
