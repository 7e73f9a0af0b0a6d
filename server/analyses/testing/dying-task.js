// Test-only analysis task (server/analyses/failed-runs.spec.ts hands it to AnalysisJobs.start({ taskFile })): the app
// and the worker process never load it, and nothing reachable from the HTTP API names a task file.
// The worker thread dies in the middle of a run, after it reported some progress (as a crash in native code or an
// exit would end it). The pool's warm-up (seed 'warm-up', worker-pool.ts) still goes to the engine's task.
const engine = require('../analysis-task.js');

module.exports = (job) => {
  if (job.input && job.input.settings && job.input.settings.seed === 'warm-up') return engine(job);
  job.port.postMessage(0.25);
  return new Promise(() => setTimeout(() => process.exit(70), 300));
};
