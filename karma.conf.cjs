// Karma for the client specs: headless Debian Chromium, and a small reporter that writes the totals
// to .data/karma-result.json so the test script can print one closing "N passed, N failed" line.
const fs = require('node:fs');
const path = require('node:path');

function TotalsReporter(baseReporterDecorator) {
  baseReporterDecorator(this);
  const totals = { passed: 0, failed: 0, skipped: 0, error: false };
  this.onSpecComplete = (_browser, result) => {
    if (result.skipped) totals.skipped++;
    else if (result.success) totals.passed++;
    else totals.failed++;
  };
  this.onBrowserError = () => { totals.error = true; };
  this.onRunComplete = () => {
    fs.mkdirSync(path.join(__dirname, '.data'), { recursive: true });
    fs.writeFileSync(path.join(__dirname, '.data', 'karma-result.json'), JSON.stringify(totals));
  };
}
TotalsReporter.$inject = ['baseReporterDecorator'];

module.exports = function (config) {
  config.set({
    basePath: '',
    frameworks: ['jasmine'],
    plugins: [
      require('karma-jasmine'),
      require('karma-chrome-launcher'),
      { 'reporter:totals': ['type', TotalsReporter] },
    ],
    client: { jasmine: { random: true }, clearContext: false },
    reporters: ['progress', 'totals'],
    browsers: ['ChromeHeadlessLocal'],
    customLaunchers: {
      ChromeHeadlessLocal: {
        base: 'ChromeHeadless',
        flags: [
          '--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--disable-quic', '--no-first-run',
          '--disable-background-networking', '--disable-component-update', '--disable-sync',
        ],
      },
    },
    browserNoActivityTimeout: 120000,
    captureTimeout: 120000,
    singleRun: true,
    restartOnFileChange: false,
  });
};
