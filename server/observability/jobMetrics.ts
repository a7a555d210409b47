import { Histogram } from 'prom-client';

/**
 * How long background jobs take in this process, by queue and outcome. One
 * per process (a worker or a web process with a worker in it), registered in
 * every metrics registry the process serves.
 */
export const jobDuration = new Histogram({
  name: 'matwright_job_duration_seconds',
  help: 'Time a background job took from start to its end, by queue and outcome',
  labelNames: ['queue', 'outcome'] as const,
  buckets: [0.25, 0.5, 1, 2, 4, 8, 15, 30, 60, 90],
  registers: [],
});
