import { describe, expect, it } from 'vitest';
import { parseRows, rowIssues } from '@/lib/validation/registers';
import { escapeSpreadsheetText, unescapeSpreadsheetText } from '@/lib/registers/spreadsheet-escape';
import { parseClipboardBlock } from '@/components/grid/clipboard';
import { mapHeaders, readCell, FILE_COLUMNS } from '@/lib/registers/columns';
import { lineBase } from '@/lib/registers/base-estimate';
import { summarise } from '@/lib/registers/dist-fields';

const line = {
  code: '1.1',
  description: 'Earthworks',
  distType: 'triangular',
  low: 100,
  mode: 120,
  high: 200,
};

describe('line item rows', () => {
  it('accepts a valid three-point line', () => {
    expect(rowIssues('items', line)).toEqual({});
  });
  it('puts the engine’s parameter message on the cell at fault', () => {
    const issues = rowIssues('items', { ...line, mode: 300 });
    expect(Object.keys(issues)).toEqual(['mode']);
    expect(issues.mode).toContain('between low and high');
  });
  it('names a text that is not a number', () => {
    expect(rowIssues('items', { ...line, low: 'abc' }).low).toBe('Low must be a number (got "abc").');
  });
  it('asks for the missing parameters of the chosen distribution', () => {
    expect(rowIssues('items', { ...line, distType: 'normal' })).toEqual({
      mean: 'Enter the mean value.',
      sd: 'Enter the standard deviation value.',
    });
  });
  it('needs an activity for a per-day line and refuses one on a lump sum', () => {
    expect(rowIssues('items', { ...line, basis: 'per-day' }).activityCode).toContain('needs its activity');
    expect(rowIssues('items', { ...line, activityCode: 'A1' }).activityCode).toContain('Only per-day');
  });
  it('names the row and the field in batch messages', () => {
    const { issues, data } = parseRows('items', [line, { ...line, code: '1.2', high: 50 }]);
    expect(data).toHaveLength(1);
    expect(issues[0].path).toBe('rows[1].high');
    expect(issues[0].message).toMatch(/^Row 2 \(1\.2\), high: /);
  });
});

describe('risk, activity and correlation rows', () => {
  it('requires a cost or a delay, and an activity for a delay', () => {
    expect(rowIssues('risks', { code: 'R1', title: 'x', probability: 0.2 }).costType).toContain(
      'cost impact, a delay',
    );
    const delay = {
      code: 'R1',
      title: 'x',
      probability: 0.2,
      delayType: 'triangular',
      delayLow: 1,
      delayMode: 2,
      delayHigh: 5,
    };
    expect(rowIssues('risks', delay).activityCodes).toContain('activities it lengthens');
    expect(rowIssues('risks', { ...delay, activityCodes: ['A1'] })).toEqual({});
    expect(rowIssues('risks', { ...delay, activityCodes: ['A1'], probability: 1.5 }).probability).toContain(
      'above 100%',
    );
    // A typed list of codes reads as the list; a code twice is named.
    expect(rowIssues('risks', { ...delay, activityCodes: 'A1, A2' })).toEqual({});
    expect(rowIssues('risks', { ...delay, activityCodes: ['A1', 'A1'] }).activityCodes).toContain(
      'A1 is listed twice',
    );
  });
  it('refuses negative durations and self-links', () => {
    const a = {
      code: 'A1',
      name: 'Dig',
      distType: 'triangular',
      low: -1,
      mode: 2,
      high: 5,
      predecessors: [],
    };
    expect(rowIssues('activities', a).low).toBe('A duration cannot be negative.');
    const self = { ...a, low: 1, predecessors: [{ code: 'A1', lag: 0 }] };
    expect(rowIssues('activities', self).predecessors).toBe('A1 cannot precede itself.');
  });
  it('keeps coefficients within [-1, 1] and pairs two different inputs', () => {
    expect(rowIssues('correlations', { aCode: 'C1', bCode: 'C2', rho: 1.2 }).rho).toContain('above 1');
    expect(rowIssues('correlations', { aCode: 'C1', bCode: 'C1', rho: 0.2 }).bCode).toBe(
      'Pick two different inputs.',
    );
  });
});

describe('spreadsheet safety and files', () => {
  it('escapes text that a spreadsheet would run as a formula, and reads it back', () => {
    for (const t of ['=1+1', '+SUM(A1)', '-2+3', '@cmd', '\tx']) {
      expect(escapeSpreadsheetText(t)).toBe(`'${t}`);
      expect(unescapeSpreadsheetText(escapeSpreadsheetText(t))).toBe(t);
    }
    expect(escapeSpreadsheetText('Earthworks')).toBe('Earthworks');
    expect(unescapeSpreadsheetText("'quoted")).toBe("'quoted");
  });
  it('splits a tab-separated block copied from a spreadsheet, with quoted cells', () => {
    expect(parseClipboardBlock('a\tb\n1\t"two\tparts"\n"say ""hi"""\t3\n')).toEqual([
      ['a', 'b'],
      ['1', 'two\tparts'],
      ['say "hi"', '3'],
    ]);
    expect(parseClipboardBlock('')).toEqual([]);
  });
  it('maps file headers by name and alias, and ignores unknown ones', () => {
    expect(mapHeaders('items', ['WBS', 'Description', 'Most likely', 'Colour', 'p90'])).toEqual([
      'code',
      'description',
      'mode',
      null,
      'high',
    ]);
    const prob = FILE_COLUMNS.risks.find((c) => c.field === 'probability')!;
    expect(readCell(prob, '35%')).toBeCloseTo(0.35, 12);
    const low = FILE_COLUMNS.items.find((c) => c.field === 'low')!;
    expect(readCell(low, '1,250,000')).toBe(1250000);
  });
});

describe('figures shown as you type', () => {
  it('gives a triangular line its mean and base', () => {
    // Triangular mean (a + b + c) / 3 = (100 + 120 + 200) / 3 (Kotz & van Dorp 2004, ch. 1).
    expect(summarise({ type: 'triangular', low: 100, mode: 120, high: 200 }).mean).toBeCloseTo(140, 10);
    // Triangular P10 for c ≥ a: a + √(0.1 (b − a)(c − a)) = 100 + √(0.1·100·20) (same reference).
    expect(summarise({ type: 'triangular', low: 100, mode: 120, high: 200 }).p10).toBeCloseTo(
      100 + Math.sqrt(200),
      8,
    );
    expect(
      lineBase(
        {
          basis: 'lump-sum',
          distType: 'triangular',
          low: 100,
          mode: 120,
          high: 200,
          base: null,
          activityCode: null,
        },
        new Map(),
      ),
    ).toBe(120);
    expect(
      lineBase(
        { basis: 'per-day', distType: 'fixed', mode: 1500, base: null, activityCode: 'A2' },
        new Map([['A2', 60]]),
      ),
    ).toBe(90000);
  });
});

describe('version 2 risk and line cells', () => {
  const base = { code: 'R1', title: 'Ground', probability: 0.3 };

  it('takes a normal cost and a lognormal delay by mean and SD', () => {
    const row = {
      ...base,
      costType: 'normal',
      costMean: 40_000,
      costSd: 8_000,
      delayType: 'lognormal',
      delayMean: 10,
      delaySd: 4,
      activityCodes: ['A1', 'A2'],
    };
    expect(rowIssues('risks', row)).toEqual({});
    // A normal needs its SD, on the SD cell (the engine's own message).
    expect(rowIssues('risks', { ...row, costSd: null }).costSd).toContain('standard deviation');
    // A lognormal given both ways is ambiguous.
    expect(rowIssues('risks', { ...row, delayLow: 5, delayHigh: 20 }).delayMean).toContain('not both');
  });

  it('accepts negative costs and delays as an opportunity, not an error', () => {
    const opportunity = {
      ...base,
      costType: 'triangular',
      costLow: -90_000,
      costMode: -60_000,
      costHigh: -20_000,
      delayType: 'uniform',
      delayLow: -8,
      delayHigh: -2,
      activityCodes: ['A3'],
    };
    expect(rowIssues('risks', opportunity)).toEqual({});
  });

  it('reads a mitigation cost as one amount or a range, never below zero', () => {
    expect(rowIssues('risks', { ...base, costType: 'fixed', costMode: 10, mitigationCost: 500 })).toEqual({});
    const range = {
      ...base,
      costType: 'fixed',
      costMode: 10,
      mitigationType: 'triangular',
      mitigationLow: 400,
      mitigationCost: 500,
      mitigationHigh: 900,
    };
    expect(rowIssues('risks', range)).toEqual({});
    expect(rowIssues('risks', { ...range, mitigationHigh: null }).mitigationHigh).toBeDefined();
    expect(rowIssues('risks', { ...range, mitigationLow: -5 }).mitigationLow).toContain('cannot be negative');
    expect(
      rowIssues('risks', { ...range, mitigationType: null, mitigationCost: null }).mitigationType,
    ).toContain('fixed or a range');
  });

  it('checks post-mitigation mean and SD with the type before the response', () => {
    const row = { ...base, costType: 'normal', costMean: 100, costSd: 20, postCostMean: 60, postCostSd: 10 };
    expect(rowIssues('risks', row)).toEqual({});
    expect(rowIssues('risks', { ...row, postCostSd: -1 }).postCostSd).toBeDefined();
  });

  it('takes a per-project-day line without an activity', () => {
    const line = {
      code: '9.1',
      description: 'Site overheads',
      basis: 'per-project-day',
      distType: 'fixed',
      mode: 800,
    };
    expect(rowIssues('items', line)).toEqual({});
    expect(rowIssues('items', { ...line, activityCode: 'A1' }).activityCode).toContain('whole project');
    expect(rowIssues('items', { ...line, distType: null, base: 5 }).distType).toContain('rate per day');
  });
});
