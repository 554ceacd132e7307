import { describe, expect, it } from 'vitest';
import {
  formatPredecessors,
  linkFromModel,
  linkToModel,
  parsePredecessors,
} from '@/lib/registers/predecessors';

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

  it('reads a link type and a signed lag after the code', () => {
    expect(parsePredecessors('A2, A3 SS+2, A4 ff-1, A5 SF, A6 FS+3, A7 SS −1.5d')).toEqual({
      ok: true,
      links: [
        { code: 'A2', lag: 0 },
        { code: 'A3', type: 'SS', lag: 2 },
        { code: 'A4', type: 'FF', lag: -1 },
        { code: 'A5', type: 'SF', lag: 0 },
        { code: 'A6', lag: 3 },
        { code: 'A7', type: 'SS', lag: -1.5 },
      ],
    });
  });

  it('takes an SS and an FF link from the same activity, not the same type twice', () => {
    expect(parsePredecessors('A1 SS+2, A1 FF+7').ok).toBe(true);
    expect(parsePredecessors('A1 SS+2, A1 SS')).toEqual({ ok: false, error: 'A1 is listed twice with SS' });
  });

  it('says how to write a link when a type is not one of the four', () => {
    const bad = parsePredecessors('A3 XS+2');
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.error).toContain('e.g. A2, A3 SS+2, A4 FF-1');
  });

  it('prints typed links back to the same text, and maps them to and from the model file', () => {
    const text = 'A2, A3 SS+2, A4 FF-1, A5 SF, A6+3';
    const parsed = parsePredecessors(text);
    expect(parsed.ok && formatPredecessors(parsed.links)).toBe(text);
    if (!parsed.ok) return;
    const model = parsed.links.map(linkToModel);
    expect(model).toEqual([
      'A2',
      { id: 'A3', type: 'SS', lag: 2 },
      { id: 'A4', type: 'FF', lag: -1 },
      { id: 'A5', type: 'SF' },
      { id: 'A6', lag: 3 },
    ]);
    expect(model.map(linkFromModel)).toEqual(parsed.links);
  });
});
