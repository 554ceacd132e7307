import { describe, expect, it } from 'vitest';
import { changedFields, recordsAChange } from '@/lib/domain/audit-changes';

// The audit rule (common practice for change logs): an entry says what changed; a save that
// changed nothing is not a change and leaves no entry.
describe('which fields an update changed', () => {
  it('names only the fields whose values differ, whatever the key order of nested values', () => {
    const before = { name: 'Intake', predecessors: [{ code: 'A1', lag: 2 }], base: 100, id: 7 };
    expect(changedFields(before, { name: 'Intake', predecessors: [{ lag: 2, code: 'A1' }] })).toEqual([]);
    expect(changedFields(before, { name: 'Outfall', base: 100 })).toEqual(['name']);
    expect(changedFields(before, { base: 120, predecessors: [] })).toEqual(['base', 'predecessors']);
  });

  it('counts empty text, null and a missing field as the same "none"', () => {
    expect(changedFields({ description: null }, { description: '' })).toEqual([]);
    expect(changedFields({}, { notes: null })).toEqual([]);
    expect(changedFields({ notes: 'x' }, { notes: null })).toEqual(['notes']);
  });

  it('records every action but an update that changed no field', () => {
    const same = { before: { assumptions: 'Dry summer' }, after: { assumptions: 'Dry summer' } };
    expect(recordsAChange({ action: 'update', ...same })).toBe(false);
    expect(recordsAChange({ action: 'update', before: same.before, after: { assumptions: 'Wet' } })).toBe(
      true,
    );
    expect(recordsAChange({ action: 'import', ...same })).toBe(true);
    expect(recordsAChange({ action: 'archive', before: null, after: null })).toBe(true);
    expect(recordsAChange({ action: 'update', before: null, after: { a: 1 } })).toBe(true);
  });
});
