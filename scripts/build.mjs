// Bundles the client, the server, the command line and the benchmarks with esbuild; and the browser
// builds of the server (a Web Worker) and of the client (VS Code for the Web).
import { build } from 'esbuild';
import { noNodeApis } from './no-node-apis.mjs';

// Style sheets are bundled as text (the HTML report inlines media/preview.css).
const common = { bundle: true, platform: 'node', target: 'node20', format: 'cjs', sourcemap: true, logLevel: 'warning', loader: { '.css': 'text' } };
const watch = process.argv.includes('--watch');

const browser = { ...common, platform: 'browser', target: 'es2022', plugins: [noNodeApis] };

await Promise.all([
  build({ ...common, entryPoints: ['client/src/extension.ts'], outfile: 'dist/extension.js', external: ['vscode'] }),
  build({ ...common, entryPoints: ['server/src/server/main.ts'], outfile: 'dist/server.js' }),
  build({ ...common, entryPoints: ['server/src/cli/bin.ts'], outfile: 'dist/cli.js', banner: { js: '#!/usr/bin/env node' } }),
  build({ ...browser, format: 'iife', entryPoints: ['server/src/server/browserMain.ts'], outfile: 'dist/browser/server.js' }),
  build({ ...browser, format: 'cjs', entryPoints: ['client/src/browserExtension.ts'], outfile: 'dist/browser/extension.js', external: ['vscode'] }),
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
