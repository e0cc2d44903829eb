/** n and degrees of freedom against the procedure. */
import { describe, expect, it } from 'vitest';
import { audit, codes, rec } from './helpers.js';

describe('n counted as observations', () => {
  it('paired t with n = 2 (df + 1) is flagged with the number of pairs', () => {
    const f = audit(rec('procedure: paired-t\nn: 18\ndf: 8')).findings.find((x) => x.code === 'n-counts-observations')!;
    expect(f.severity).toBe('error');
    expect(f.message).toMatch(/9 pairs/);
    expect(f.fix).toMatch(/n = 9 pairs.*df = 8/);
    expect(codes(audit(rec('procedure: paired-t\nn: 18\ndf: 8')))).not.toContain('df-inconsistent');
  });
  it('paired t with n = n1 + n2 is flagged', () => {
    expect(codes(audit(rec('procedure: paired-t\nn: 24\nn1: 12\nn2: 12')))).toContain('n-counts-observations');
  });
  it('paired t with n pairs and df = n - 1 is fine', () => {
    expect(codes(audit(rec('procedure: paired-t\nn: 9\ndf: 8'))).filter((c) => c.startsWith('n-') || c.startsWith('df-'))).toEqual([]);
  });
});

describe('counts that do not add up', () => {
  it('independent: n differs from n1 + n2', () => {
    expect(codes(audit(rec('procedure: welch-t\nn: 30\nn1: 12\nn2: 15')))).toContain('n-inconsistent');
  });
  it('paired: unequal counts per condition', () => {
    expect(codes(audit(rec('procedure: paired-t\nn1: 12\nn2: 11')))).toContain('n-inconsistent');
  });
});

describe('degrees of freedom', () => {
  it('paired: df must be pairs - 1', () => {
    const f = audit(rec('procedure: paired-t\nn: 15\ndf: 13')).findings.find((x) => x.code === 'df-inconsistent')!;
    expect(f.message).toMatch(/should be 14/);
  });
  it('pooled: df must be n1 + n2 - 2', () => {
    expect(codes(audit(rec('procedure: pooled-t\nn1: 10\nn2: 12\ndf: 20')))).not.toContain('df-inconsistent');
    expect(codes(audit(rec('procedure: pooled-t\nn1: 10\nn2: 12\ndf: 21')))).toContain('df-inconsistent');
  });
  it('crossover: df = n1 + n2 - 2 over the sequence groups', () => {
    expect(codes(audit(rec('procedure: crossover-t\nn1: 8\nn2: 9\ndf: 15')))).not.toContain('df-inconsistent');
    expect(codes(audit(rec('procedure: crossover-t\nn1: 8\nn2: 9\ndf: 16')))).toContain('df-inconsistent');
  });
  it('Welch without SDs: between min(n1, n2) - 1 and n1 + n2 - 2', () => {
    expect(codes(audit(rec('procedure: welch-t\nn1: 14\nn2: 11\ndf: 12.04')))).not.toContain('df-inconsistent');
    expect(codes(audit(rec('procedure: welch-t\nn1: 14\nn2: 11\ndf: 9.5')))).toContain('df-inconsistent');
    expect(codes(audit(rec('procedure: welch-t\nn1: 14\nn2: 11\ndf: 23.5')))).toContain('df-inconsistent');
  });
  it('Welch with SDs: the Welch-Satterthwaite value; a whole-number df may be rounded or cut down', () => {
    // SDs 0.257 and 0.714 with n 14 and 11 give df 12.04 (scipy, test/fixtures/scipy-audit/cases.json, valve case)
    const g = 'groups:\n  - {n: 14, sd: 0.2571}\n  - {n: 11, sd: 0.7144}';
    expect(codes(audit(rec(`procedure: welch-t\ndf: 12.04\n${g}`)))).not.toContain('df-inconsistent');
    expect(codes(audit(rec(`procedure: welch-t\ndf: 12\n${g}`)))).not.toContain('df-inconsistent');
    const f = audit(rec(`procedure: welch-t\ndf: 23\n${g}`)).findings.find((x) => x.code === 'df-inconsistent')!;
    expect(f.message).toMatch(/pooled df/);
  });
});
