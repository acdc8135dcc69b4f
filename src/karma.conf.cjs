// Karma for the Angular component specs: Debian's Chromium, headless, as root, with no network of its own.
const { writeFileSync } = require('node:fs');

/** Prints `N passed, N failed` on a line of its own and, when asked, writes the counts for the test runner. */
function CountingReporter(baseReporterDecorator) {
  baseReporterDecorator(this);
  let passed = 0;
  let failed = 0;
  let skipped = 0;
  this.onSpecComplete = (_browser, result) => {
    if (result.skipped) skipped++;
    else if (result.success) passed++;
    else failed++;
  };
  this.onRunComplete = (_browsers, results) => {
    if (results.error && passed + failed === 0) failed++;
    this.write(`\n${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}\n`);
    if (process.env.KEYLOOM_KARMA_COUNTS) {
      writeFileSync(process.env.KEYLOOM_KARMA_COUNTS, JSON.stringify({ passed, failed, skipped }));
    }
  };
}
CountingReporter.$inject = ['baseReporterDecorator'];

module.exports = function (config) {
  config.set({
    basePath: '..',
    frameworks: ['jasmine'],
    plugins: [
      require('karma-jasmine'),
      require('karma-chrome-launcher'),
      { 'reporter:counting': ['type', CountingReporter] },
    ],
    client: { jasmine: { random: true }, clearContext: false },
    reporters: ['progress', 'counting'],
    proxies: { '/base/media/': '/media/' },
    browsers: ['ChromeHeadlessKeyloom'],
    customLaunchers: {
      ChromeHeadlessKeyloom: {
        base: 'ChromeHeadless',
        flags: [
          '--no-sandbox',
          '--headless',
          '--disable-gpu',
          '--disable-background-networking',
          '--disable-component-update',
          '--disable-sync',
          '--no-first-run',
          '--disable-quic',
          '--disable-dev-shm-usage',
          // A click in a spec is not a person's gesture: let audio contexts run, as they do after a real click.
          '--autoplay-policy=no-user-gesture-required',
        ],
      },
    },
    singleRun: true,
    restartOnFileChange: false,
    browserNoActivityTimeout: 120000,
  });
};
