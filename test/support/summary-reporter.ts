/**
 * Prints one plain closing line, "tests: N passed, N failed, N skipped", after vitest's own
 * summary, so that CI logs and scripts can read the outcome without parsing vitest's layout.
 */
import type { Reporter, TestModule } from 'vitest/node';

export default class SummaryReporter implements Reporter {
  onTestRunEnd(testModules: ReadonlyArray<TestModule>): void {
    let passed = 0;
    let failed = 0;
    let skipped = 0;
    for (const m of testModules) {
      for (const t of m.children.allTests()) {
        const s = t.result().state;
        if (s === 'passed') passed++;
        else if (s === 'failed') failed++;
        else skipped++;
      }
      if (m.state() === 'failed' && [...m.children.allTests()].length === 0) failed++;
    }
    process.stdout.write(`\ntests: ${passed} passed, ${failed} failed, ${skipped} skipped\n`);
  }
}
