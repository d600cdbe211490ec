import { defineConfig } from 'vitest/config';

/**
 * Two projects: `unit` (the chemistry, the notes scanner, the language service and the client's logic,
 * called directly: no build needed, `npm run test:unit`) and `integration` (the built server, command
 * line, extension bundle, browser, packages and Neovim, which `npm test` builds first).
 */
const shared = { setupFiles: ['test/setup.ts'], testTimeout: 30_000, hookTimeout: 30_000 };

export default defineConfig({
  test: {
    projects: [
      {
        test: {
          ...shared,
          name: 'unit',
          include: [
            'test/chem/**/*.test.ts',
            'test/notes/**/*.test.ts',
            'test/service/**/*.test.ts',
            'test/client/client*.test.ts',
            'test/client/grammar.test.ts',
            'test/layering.test.ts',
          ],
        },
      },
      {
        test: {
          ...shared,
          name: 'integration',
          include: [
            'test/server/**/*.test.ts',
            'test/cli/**/*.test.ts',
            'test/browser/**/*.test.ts',
            'test/package/**/*.test.ts',
            'test/client/extension.test.ts',
          ],
        },
      },
    ],
  },
});
