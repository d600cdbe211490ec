import { run } from './main';
import { isCheckWorker, serveChecks } from './pool';

// dist/cli.js is also the worker of a parallel `check` (see pool.ts).
if (isCheckWorker()) serveChecks();
else {
  void run(process.argv.slice(2)).then(
    (code) => (process.exitCode = code),
    (e: unknown) => {
      process.stderr.write(`ionwright: internal error: ${e instanceof Error ? e.message.split('\n')[0] : String(e)}\n`);
      process.exitCode = 2;
    },
  );
}
