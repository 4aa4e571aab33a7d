import { defineConfig } from '@playwright/test';
// Debian's chromium (installed with apt-get), never a downloaded browser, with the same flags as `mixwise report`.
import { CHROMIUM_ARGS, chromiumPath } from './src/cli/chromium.ts';

// MIXWISE_E2E_PORT lets two checkouts run their browser tests at once on one machine.
const PORT = Number(process.env.MIXWISE_E2E_PORT ?? 4174);

export default defineConfig({
  testDir: 'e2e',
  outputDir: 'test-results',
  timeout: 60_000,
  fullyParallel: false,
  workers: 1,
  reporter: [['list']],
  use: {
    baseURL: `http://127.0.0.1:${PORT}/`,
    viewport: { width: 1400, height: 1000 },
    acceptDownloads: true,
    launchOptions: { executablePath: chromiumPath(process.env), args: [...CHROMIUM_ARGS] },
  },
  webServer: {
    // Build, then serve exactly the bundle Electron loads (web mode).
    command: `npx electron-vite build && npx vite preview --outDir out/renderer --host 127.0.0.1 --port ${PORT} --strictPort`,
    url: `http://127.0.0.1:${PORT}/`,
    reuseExistingServer: false,
    timeout: 120_000,
    stdout: 'ignore',
    stderr: 'pipe',
  },
});
