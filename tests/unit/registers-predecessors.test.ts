import { describe, expect, it } from 'vitest';
import { formatPredecessors, parsePredecessors } from '@/lib/registers/predecessors';

describe('predecessors typed as text', () => {
  it('reads codes, lags and leads', () => {
    expect(parsePredecessors('A1, A3+5, A4-2')).toEqual({
      ok: true,
      links: [
        { code: 'A1', lag: 0 },
        { code: 'A3', lag: 5 },
        { code: 'A4', lag: -2 },
      ],
    });
    expect(parsePredecessors(' A3 + 5d ; B7')).toEqual({
      ok: true,
      links: [
        { code: 'A3', lag: 5 },
        { code: 'B7', lag: 0 },
      ],
    });
    expect(parsePredecessors('')).toEqual({ ok: true, links: [] });
  });

  it('keeps a known code that ends in a dash and digits as one code', () => {
    expect(parsePredecessors('EW-2', new Set(['EW-2']))).toEqual({
      ok: true,
      links: [{ code: 'EW-2', lag: 0 }],
    });
    expect(parsePredecessors('EW-2')).toEqual({ ok: true, links: [{ code: 'EW', lag: -2 }] });
  });

  it('says what is wrong', () => {
    const twice = parsePredecessors('A1, A1+3');
    expect(twice).toEqual({ ok: false, error: 'A1 is listed twice' });
    const bad = parsePredecessors('A1, after A2');
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.error).toContain('"after A2"');
  });

  it('formats what it parses back to the same text', () => {
    const text = 'A1, A3+5, A4-2';
    const parsed = parsePredecessors(text);
    expect(parsed.ok && formatPredecessors(parsed.links)).toBe(text);
  });
});
