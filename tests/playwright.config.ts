// Browser tests: Playwright driving Debian's chromium (/usr/bin/chromium; the Playwright browser
// download does not work here, never run `playwright install`). Run through `npm test`, which
// starts the test-profile services and exports their environment first; Playwright itself starts
// the app (server.ts on 127.0.0.1:3100) from the build that npm test made.
//
// Projects:
//   desktop  1280×800, every spec except the ones tagged @camera
//   phone    360×740 touch, only specs tagged @phone
//   camera   specs tagged @camera, with a fake camera that plays .data/test/fake-camera.y4m
// Screenshots taken by tests go to .data/test/screenshots/; failure traces and screenshots to
// .data/test/playwright-results/; the JSON report to .data/test/playwright.json.
import path from 'node:path';
import { defineConfig, devices } from '@playwright/test';

const root = path.resolve(import.meta.dirname, '..');
// npm test exports the test profile (RIMELINE_DATA=.data/test, APP_PORT=3100); a private run beside it
// exports its own folder and port (DEVELOPERS.md, "Working in parallel").
const testData = process.env.RIMELINE_DATA || path.join(root, '.data', 'test');
const appPort = Number(process.env.APP_PORT || 3100);
const isCI = Boolean(process.env.CI);

const chromiumArgs = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
  '--disable-quic',
];

export const fakeCameraFile = path.join(testData, 'fake-camera.y4m');

export default defineConfig({
  testDir: './e2e',
  // Puts the test database back to the demo scenario before the browser tests.
  globalSetup: './e2e/global-setup.ts',
  outputDir: path.join(testData, 'playwright-results'),
  workers: 1,
  fullyParallel: false,
  retries: isCI ? 1 : 0,
  forbidOnly: isCI,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: [[isCI ? 'line' : 'list'], ['json', { outputFile: path.join(testData, 'playwright.json') }]],
  use: {
    baseURL: `http://localhost:${appPort}`,
    screenshot: 'only-on-failure',
    trace: 'retain-on-failure',
    launchOptions: { executablePath: '/usr/bin/chromium', args: chromiumArgs },
    // Requests a service worker handles escape page.route; only the offline specs let it run
    // (test.use({ serviceWorkers: 'allow' })).
    serviceWorkers: 'block',
  },
  projects: [
    {
      name: 'desktop',
      grepInvert: /@camera/,
      use: { viewport: { width: 1280, height: 800 } },
    },
    {
      name: 'phone',
      grep: /@phone/,
      use: {
        viewport: { width: 360, height: 740 },
        deviceScaleFactor: 2,
        isMobile: true,
        hasTouch: true,
        userAgent: devices['Pixel 7']?.userAgent,
      },
    },
    {
      name: 'camera',
      grep: /@camera/,
      use: {
        viewport: { width: 1280, height: 800 },
        permissions: ['camera'],
        launchOptions: {
          executablePath: '/usr/bin/chromium',
          args: [
            ...chromiumArgs,
            '--use-fake-device-for-media-stream',
            '--use-fake-ui-for-media-stream',
            `--use-file-for-fake-video-capture=${fakeCameraFile}`,
          ],
        },
      },
    },
  ],
  // The shell records the server's pid (exec keeps it) so npm test can stop a server left behind
  // by a crashed run; Playwright starts and stops it itself.
  webServer: {
    command: `mkdir -p '${testData}/run' && echo $$ > '${testData}/run/app.pid' && exec node --import tsx server.ts -H 127.0.0.1 -p ${appPort}`,
    cwd: root,
    url: `http://127.0.0.1:${appPort}/api/health`,
    reuseExistingServer: false,
    timeout: 120_000,
    stdout: 'ignore',
    stderr: 'pipe',
  },
});
