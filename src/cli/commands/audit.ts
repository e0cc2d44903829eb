/**
 * `tandem audit RECORD.yaml [--data FILE] [--report FILE.md] [--json] [--force]`
 *
 * Checks a colleague's reported two-condition analysis: the design (from the study facts)
 * against the procedure, and the reported numbers against each other; with --data, recomputes
 * the colleague's procedure and the recommended one side by side. Exit 0 when no finding is an
 * error, 1 when one is, 2 on bad input, 3 when the review file was not written.
 */
import { isAbsolute, resolve } from 'node:path';
import type { IO } from '../io.js';
import { EXIT } from '../exit-codes.js';
import { boolOpt, parseOptions, stringOpt } from '../options.js';
import { InputError } from '../../errors.js';

const HELP = `Usage: tandem audit RECORD.yaml [--data FILE] [--report FILE.md] [--json] [--force]

Checks a colleague's reported analysis of a two-condition comparison. RECORD.yaml (format
tandem-audit/1, schema schemas/audit-v1.schema.json) holds the study facts (the interview's
answers, or an answers file or plan file) and what was reported: the procedure, the direction of
subtraction, the alternative, and the numbers with the digits as written.

Options:
  --data FILE       recompute the colleague's procedure and the recommended one on this CSV
                    (read with the record's data.mapping, or the plan's), and check the pairing
  --report FILE.md  write the review as Markdown, ready to send
  --json            print the result as JSON (findings with code, severity, message, fix)
  --force           replace an existing --report file
  --rules DIR       use another rule base folder (default: the bundled rules/)

Exit codes: 0 no error finding, 1 at least one error finding, 2 bad input, 3 review not written.
`;

export default async function audit(argv: string[], io: IO): Promise<number> {
  const opts = parseOptions(argv, { data: { type: 'string' }, report: { type: 'string' }, json: { type: 'boolean' }, force: { type: 'boolean' }, rules: { type: 'string' } }, 'audit');
  if (boolOpt(opts, 'help')) {
    io.stdout.write(HELP);
    return EXIT.ok;
  }
  if (opts.positionals.length !== 1) {
    throw new InputError(`audit takes one audit record file; got ${opts.positionals.length === 0 ? 'none' : opts.positionals.map((p) => `'${p}'`).join(', ')} (see 'tandem audit --help')`);
  }
  const at = (p: string): string => (isAbsolute(p) ? p : resolve(io.cwd, p));
  const shown = opts.positionals[0];
  const report = stringOpt(opts, 'report');
  const data = stringOpt(opts, 'data');
  const rules = stringOpt(opts, 'rules');
  const force = boolOpt(opts, 'force');
  if (report !== undefined && !report.trim()) throw new InputError('--report needs a file name, e.g. --report review.md');

  const { readAuditRecord } = await import('../../audit/read.js');
  const { auditRecord, hasError } = await import('../../audit/index.js');
  const read = await readAuditRecord(at(shown), shown, rules ? at(rules) : undefined);
  let onData;
  if (data !== undefined) {
    const { auditOnData } = await import('../../audit/on-data.js');
    onData = (ctx: Parameters<typeof auditOnData>[2], out: Parameters<typeof auditOnData>[3]) => auditOnData(at(data), data, ctx, out).comparison;
  }
  const result = auditRecord(read.record, read.recommendation, { ...(read.recommendationNote ? { recommendationNote: read.recommendationNote } : {}), ...(onData ? { onData } : {}) });
  const code = hasError(result) ? EXIT.findings : EXIT.ok;

  const rep = await import('../../report/audit.js');
  if (report !== undefined) {
    const { writeFileAtomic } = await import('../../fs/atomic.js');
    await writeFileAtomic(at(report), rep.renderAuditMarkdown(result), { force });
  }
  if (boolOpt(opts, 'json')) {
    io.stdout.write(JSON.stringify(rep.auditJson(result, code), null, 2) + '\n');
  } else {
    const { makeStyle } = await import('../../report/style.js');
    io.stdout.write(rep.renderAuditText(result, makeStyle(io.color)));
    if (report !== undefined) io.stdout.write(`Review written to ${report}\n`);
  }
  return code;
}
