import { describe, expect, it } from 'vitest';
import { dueStatus } from './due';

describe('dueStatus', () => {
  it('flags overdue, today and tomorrow for shots not yet captured', () => {
    expect(dueStatus('2027-01-15', 'planned', '2027-01-16')).toBe('overdue');
    expect(dueStatus('2027-01-16', 'retake', '2027-01-16')).toBe('today');
    expect(dueStatus('2027-01-17', 'planned', '2027-01-16')).toBe('tomorrow');
    expect(dueStatus('2027-01-18', 'planned', '2027-01-16')).toBeNull();
  });
  it('crosses month and year ends', () => {
    expect(dueStatus('2027-01-01', 'planned', '2026-12-31')).toBe('tomorrow');
    expect(dueStatus('2028-03-01', 'planned', '2028-02-29')).toBe('tomorrow');
  });
  it('says nothing for a captured shot or one without a date', () => {
    expect(dueStatus('2027-01-15', 'captured', '2027-01-16')).toBeNull();
    expect(dueStatus(null, 'planned', '2027-01-16')).toBeNull();
  });
});
