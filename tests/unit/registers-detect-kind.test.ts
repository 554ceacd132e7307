import { describe, expect, it } from 'vitest';
import { likelyKind, wrongKindMessage } from '@/lib/registers/detect-kind';

// The headers below are the ones the app's own exports write (lib/registers/columns.ts), and a
// hand-made sheet with common spreadsheet names for the same columns.
const LINE_ITEMS = ['WBS code', 'Description', 'Basis', 'Distribution', 'Low', 'Most likely', 'High', 'Base'];
const RISKS = ['Code', 'Title', 'Cause', 'Probability', 'Cost distribution', 'Cost low', 'Cost high'];
const SCHEDULE = ['Code', 'Name', 'Distribution', 'Low', 'Most likely', 'High', 'Predecessors'];

describe('which register a file describes', () => {
  it('recognises each register from its headers', () => {
    expect(likelyKind(LINE_ITEMS)).toBe('items');
    expect(likelyKind(RISKS)).toBe('risks');
    expect(likelyKind(SCHEDULE)).toBe('activities');
    expect(likelyKind(['Input A', 'Input B', 'Coefficient'])).toBe('correlations');
    expect(likelyKind(['Colour', 'Size'])).toBeNull();
  });

  it('names a line-items file dropped on the risk register in one message', () => {
    const message = wrongKindMessage('risks', LINE_ITEMS, 'CSV');
    expect(message).toContain('looks like a line items file');
    expect(message).toContain('Line items tab');
    expect(wrongKindMessage('items', LINE_ITEMS, 'CSV')).toBeNull();
  });

  it('names a schedule sheet dropped on the risk register, though its Code and Name read as a risk', () => {
    expect(wrongKindMessage('risks', SCHEDULE, 'Schedule')).toMatch(
      /^Sheet "Schedule" looks like a schedule file/,
    );
    expect(wrongKindMessage('activities', SCHEDULE, 'Schedule')).toBeNull();
    expect(wrongKindMessage('risks', RISKS, 'Risk events')).toBeNull();
  });

  it('says which required column is missing when the file fits no register', () => {
    expect(wrongKindMessage('risks', ['Code', 'Probability'], 'Sheet1')).toMatch(
      /^Sheet "Sheet1" has no Title column/,
    );
  });
});
