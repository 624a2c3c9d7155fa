import fs from 'node:fs';

/** Counts of one suite; `notes` explain anything unusual (crash, nothing found). */
export interface SuiteCounts {
  passed: number;
  failed: number;
  skipped: number;
  notes: string[];
}

interface VitestJson {
  numPassedTests: number;
  numFailedTests: number;
  numPendingTests: number;
  numTodoTests: number;
  testResults: { name: string; status: string; message: string; assertionResults: { status: string }[] }[];
}

/**
 * Reads vitest's JSON report. A file that failed to load (syntax error, a
 * throwing import) has no test results of its own, so each such file counts
 * as one failure; a run that ended badly without a report, or with a non-zero
 * exit and no failed test, counts as one failure too — never as 0 passed.
 */
export function countVitest(reportFile: string, exitCode: number): SuiteCounts {
  if (!fs.existsSync(reportFile)) {
    return { passed: 0, failed: 1, skipped: 0, notes: [`vitest exited with code ${exitCode} without writing its report`] };
  }
  const report = JSON.parse(fs.readFileSync(reportFile, 'utf8')) as VitestJson;
  const counts: SuiteCounts = {
    passed: report.numPassedTests,
    failed: report.numFailedTests,
    skipped: report.numPendingTests + report.numTodoTests,
    notes: [],
  };
  const brokenFiles = report.testResults.filter(
    (file) => file.status === 'failed' && !file.assertionResults.some((test) => test.status === 'failed'),
  );
  if (brokenFiles.length > 0) {
    counts.failed += brokenFiles.length;
    counts.notes.push(`${brokenFiles.length} test file(s) failed outside any test (load error or failing hook)`);
  }
  if (exitCode !== 0 && counts.failed === 0) {
    counts.failed = 1;
    counts.notes.push(`vitest exited with code ${exitCode} although no test failed (see its output above)`);
  }
  if (report.testResults.length === 0) counts.notes.push('no test files found');
  return counts;
}

interface PlaywrightJson {
  stats: { expected: number; unexpected: number; flaky: number; skipped: number };
  errors: { message?: string }[];
}

/** Reads Playwright's JSON report; flaky tests (passed on retry) count as passed and are noted. */
export function countPlaywright(reportFile: string, exitCode: number): SuiteCounts {
  if (!fs.existsSync(reportFile)) {
    return { passed: 0, failed: 1, skipped: 0, notes: [`playwright exited with code ${exitCode} without writing its report`] };
  }
  const report = JSON.parse(fs.readFileSync(reportFile, 'utf8')) as PlaywrightJson;
  const counts: SuiteCounts = {
    passed: report.stats.expected + report.stats.flaky,
    failed: report.stats.unexpected,
    skipped: report.stats.skipped,
    notes: [],
  };
  if (report.stats.flaky > 0) counts.notes.push(`${report.stats.flaky} flaky (passed on retry)`);
  if (report.errors.length > 0 && counts.failed === 0) {
    counts.failed = 1;
    counts.notes.push(`errors outside tests: ${report.errors.map((error) => error.message?.split('\n')[0]).join('; ')}`);
  }
  if (exitCode !== 0 && counts.failed === 0) {
    counts.failed = 1;
    counts.notes.push(`playwright exited with code ${exitCode} although no test failed`);
  }
  return counts;
}
