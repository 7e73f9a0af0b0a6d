// Test-only analysis task (server/analyses/failed-runs.spec.ts hands it to AnalysisJobs.start({ taskFile })): the app
// and the worker process never load it, and nothing reachable from the HTTP API names a task file.
// The engine throws, as it does for data it cannot analyse. The pool's warm-up (seed 'warm-up', worker-pool.ts)
// still goes to the engine's task, so only a user's analysis fails.
const engine = require('../analysis-task.js');

module.exports = (job) => {
  if (job.input && job.input.settings && job.input.settings.seed === 'warm-up') return engine(job);
  job.port.close();
  throw new Error('The engine stopped: a failure injected by the test');
};
