import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';

// Four kinds of test, each its own project so that they run with the right environment:
// geometry and other pure units in Node, components in happy-dom, the API against the real MariaDB that
// scripts/test.mjs started, and the browser tests in Chromium. API and browser files share one database
// and one server, so they run one file at a time.
export default defineConfig({
  plugins: [react()],
  test: {
    projects: [
      {
        extends: true,
        test: { name: 'unit', include: ['tests/geometry/**/*.test.ts', 'tests/unit/**/*.test.ts'], environment: 'node' },
      },
      {
        extends: true,
        test: { name: 'components', include: ['tests/components/**/*.test.tsx'], environment: 'happy-dom', setupFiles: ['tests/components/setup.ts'] },
      },
      {
        extends: true,
        test: { name: 'api', include: ['tests/api/**/*.test.ts'], environment: 'node', fileParallelism: false, testTimeout: 30000, hookTimeout: 60000 },
      },
      {
        extends: true,
        test: { name: 'e2e', include: ['tests/e2e/**/*.test.ts'], environment: 'node', fileParallelism: false, testTimeout: 60000, hookTimeout: 120000 },
      },
    ],
  },
});
