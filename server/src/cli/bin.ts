import { run } from './main';
import { EXIT_OUTPUT_CLOSED } from './io';
import { isCheckWorker, serveChecks } from './pool';

// dist/cli.js is also the worker of a parallel `check` (see pool.ts).
if (isCheckWorker()) serveChecks();
else {
  // The reader of stdout went away (`ionwright check notes | head -1`): stop at once, quietly, with the
  // status a shell shows for a process ended by SIGPIPE (Node ignores the signal itself). Workers end
  // with the process.
  process.stdout.on('error', (e: NodeJS.ErrnoException) => {
    if (e.code === 'EPIPE' || e.code === 'ERR_STREAM_DESTROYED') process.exit(EXIT_OUTPUT_CLOSED);
    process.stderr.write(`ionwright: cannot write the output: ${e.message.split('\n')[0]}\n`);
    process.exit(2);
  });
  // Nothing more can be said on a closed stderr; the exit status still tells.
  process.stderr.on('error', () => undefined);
  void run(process.argv.slice(2)).then(
    (code) => (process.exitCode = code),
    (e: unknown) => {
      process.stderr.write(`ionwright: internal error: ${e instanceof Error ? e.message.split('\n')[0] : String(e)}\n`);
      process.exitCode = 2;
    },
  );
}
