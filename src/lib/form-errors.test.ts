import { describe, expect, it } from 'vitest';
import { ApiError } from './api-client';
import { apiFieldError, applyApiFieldErrors, fieldLabel, plainFieldError, problemSummary } from './form-errors';

// The problem+json a rejected review without a note gets (server/http/validate.ts).
const rejectWithoutNote = new ApiError(400, 'Invalid request', 'Invalid request body: note is required when rejecting', [
  { path: 'body.note', message: 'is required when rejecting' },
]);

describe('server field errors in plain words', () => {
  it('names fields as people say them, without wire prefixes or unit suffixes', () => {
    expect(fieldLabel('body.note')).toBe('Note');
    expect(fieldLabel('body.chamberPressurePa')).toBe('Chamber pressure');
    expect(fieldLabel('body.seriesId')).toBe('Series');
    expect(fieldLabel('query.tapeRangeM')).toBe('Tape range');
    expect(plainFieldError('body.note', 'is required when rejecting')).toBe('Note is required when rejecting.');
  });

  it('never shows the raw validation detail as the summary', () => {
    expect(problemSummary(rejectWithoutNote)).toBe('Note is required when rejecting.');
    expect(problemSummary(rejectWithoutNote, ['note'])).toBe('Check the field marked below.');
    expect(problemSummary(rejectWithoutNote)).not.toMatch(/Invalid request/);
  });

  it('puts the message on the matching form field', () => {
    expect(apiFieldError(rejectWithoutNote, 'note')).toBe('Is required when rejecting.');
    expect(apiFieldError(rejectWithoutNote, 'label')).toBeUndefined();
    const set: [string, string][] = [];
    const placed = applyApiFieldErrors<{ note: string; label: string }>(rejectWithoutNote, (name, e) => set.push([name, e.message ?? '']), ['note', 'label']);
    expect(placed).toEqual(['note']);
    expect(set).toEqual([['note', 'Is required when rejecting.']]);
  });

  it('keeps the detail of other problems', () => {
    expect(problemSummary(new ApiError(409, 'Conflict', 'The series still has 2 shots.'))).toBe('The series still has 2 shots.');
  });
});
