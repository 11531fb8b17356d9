// Karma for the Angular specs: jasmine in Debian's headless Chromium (CHROME_BIN).
const fs = require('node:fs');

/** Writes the spec counts to KARMA_SUMMARY_FILE so `npm test` can sum every suite. */
function SummaryReporter(baseReporterDecorator) {
  baseReporterDecorator(this);
  const counts = { passed: 0, failed: 0, skipped: 0 };
  this.onSpecComplete = (_browser, result) => {
    if (result.skipped) counts.skipped += 1;
    else if (result.success) counts.passed += 1;
    else counts.failed += 1;
  };
  this.onRunComplete = (_browsers, results) => {
    if (results.error) counts.failed += 1;
    if (process.env.KARMA_SUMMARY_FILE) fs.writeFileSync(process.env.KARMA_SUMMARY_FILE, JSON.stringify(counts));
  };
}
SummaryReporter.$inject = ['baseReporterDecorator'];

module.exports = function (config) {
  config.set({
    basePath: '',
    frameworks: ['jasmine'],
    plugins: [
      require('karma-jasmine'),
      require('karma-chrome-launcher'),
      require('karma-jasmine-html-reporter'),
      require('karma-coverage'),
      { 'reporter:cw-summary': ['type', SummaryReporter] },
    ],
    client: { jasmine: { random: true }, clearContext: false },
    reporters: ['dots', 'cw-summary'],
    browsers: ['ChromeHeadlessCI'],
    customLaunchers: {
      ChromeHeadlessCI: {
        base: 'ChromeHeadless',
        flags: [
          '--no-sandbox',
          '--headless',
          '--disable-gpu',
          '--disable-dev-shm-usage',
          '--disable-quic',
          '--no-first-run',
          '--disable-background-networking',
          '--disable-component-update',
          '--disable-sync',
        ],
      },
    },
    browserNoActivityTimeout: 120000,
    captureTimeout: 120000,
    singleRun: true,
    restartOnFileChange: false,
  });
};
