// A jest reporter that writes the run's counts to $JEST_COUNTS_FILE: numbers only, read from each test's status,
// so a failure whose error cannot be serialised (a circular object, a socket) still counts as one failed test.
// A test file that fails before its tests run counts as one failed test.
const fs = require('node:fs');

class CountReporter {
  onRunComplete(_contexts, results) {
    const file = process.env.JEST_COUNTS_FILE;
    if (!file) return;
    let passed = 0;
    let failed = 0;
    let total = 0;
    for (const suite of results.testResults ?? []) {
      const tests = suite.testResults ?? [];
      for (const t of tests) {
        total += 1;
        if (t.status === 'passed') passed += 1;
        else if (t.status === 'failed') failed += 1;
      }
      // the file could not run (a syntax error, a failing beforeAll with no test reported)
      if (suite.testExecError || (tests.length === 0 && suite.failureMessage)) failed += 1;
    }
    fs.writeFileSync(file, JSON.stringify({ passed, failed, total }));
  }
}

module.exports = CountReporter;
