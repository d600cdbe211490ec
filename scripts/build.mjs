// Bundles the client, the server, the command line and the benchmarks with esbuild.
import { build } from 'esbuild';

// Style sheets are bundled as text (the HTML report inlines media/preview.css).
const common = { bundle: true, platform: 'node', target: 'node20', format: 'cjs', sourcemap: true, logLevel: 'warning', loader: { '.css': 'text' } };
const watch = process.argv.includes('--watch');

await Promise.all([
  build({ ...common, entryPoints: ['client/src/extension.ts'], outfile: 'dist/extension.js', external: ['vscode'] }),
  build({ ...common, entryPoints: ['server/src/server/main.ts'], outfile: 'dist/server.js' }),
  build({ ...common, entryPoints: ['server/src/cli/bin.ts'], outfile: 'dist/cli.js', banner: { js: '#!/usr/bin/env node' } }),
  ...(process.argv.includes('--bench')
    ? [
        build({ ...common, entryPoints: ['bench/run.ts'], outfile: 'dist/bench.js' }),
        build({ ...common, entryPoints: ['bench/memory-probes.ts'], outfile: 'dist/memory-probes.js' }),
      ]
    : []),
  ...(process.argv.includes('--screenshots')
    ? [build({ ...common, entryPoints: ['scripts/screenshots.ts'], outfile: 'dist/screenshots.js', external: ['playwright-core'] })]
    : []),
]);
if (watch) console.log('watch mode is not provided; run npm run build again');
