import fs from 'node:fs';

/** Writes the spec counts to JASMINE_SUMMARY_FILE so `npm test` can sum every suite. */
const summaryFile = process.env.JASMINE_SUMMARY_FILE;
if (summaryFile) {
  const counts = { passed: 0, failed: 0, skipped: 0 };
  jasmine.getEnv().addReporter({
    specDone(result) {
      if (result.status === 'passed') counts.passed += 1;
      else if (result.status === 'failed') counts.failed += 1;
      else counts.skipped += 1;
    },
    suiteDone(result) {
      // an afterAll failure fails the suite without failing a spec
      if (result.status === 'failed') counts.failed += 1;
    },
    jasmineDone(result) {
      if (result.overallStatus === 'failed' && counts.failed === 0) counts.failed += 1;
      fs.writeFileSync(summaryFile, JSON.stringify(counts));
    },
  });
}
