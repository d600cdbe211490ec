// The browser builds may not use Node: an import of a Node module (`node:fs`, `path`, …) anywhere in what
// they bundle fails the build, naming the importing file, rather than shipping a bundle that breaks in
// the worker. (test/browser/worker.browser.test.ts checks that it does.)
import { builtinModules } from 'node:module';

const NODE_MODULES = new Set([...builtinModules, ...builtinModules.map((m) => `node:${m}`)]);

export const noNodeApis = {
  name: 'no-node-apis',
  setup(build) {
    build.onResolve({ filter: /.*/ }, (args) => {
      if (!NODE_MODULES.has(args.path) && !args.path.startsWith('node:')) return undefined;
      return { errors: [{ text: `'${args.path}' is a Node module, imported by ${args.importer}: the browser build runs without Node APIs` }] };
    });
  },
};
