import { agoWords, durationWords, progressStep, stepDetails } from './home-words';
import { request } from './home-fixtures';

describe('home words', () => {
  it('says durations and ages in plain words', () => {
    expect(durationWords(1)).toBe('1 minute');
    expect(durationWords(125)).toBe('2 hours 5 minutes');
    expect(durationWords(120)).toBe('2 hours');
    expect(durationWords(3 * 24 * 60 + 4 * 60)).toBe('3 days 4 hours');
    const now = Date.parse('2026-03-02T10:00:00Z');
    expect(agoWords('2026-03-02T09:59:40Z', now)).toBe('just now');
    expect(agoWords('2026-03-02T09:48:00Z', now)).toBe('12 minutes ago');
    expect(agoWords('2026-03-02T07:00:00Z', now)).toBe('3 hours ago');
    expect(agoWords('2026-02-27T10:00:00Z', now)).toBe('3 days ago');
  });

  it("folds the server's progress words into four steps", () => {
    expect(progressStep('received')).toBe(0);
    expect(progressStep('accepted')).toBe(1);
    expect(progressStep('technician on site')).toBe(2);
    expect(progressStep('verified')).toBe(3);
    expect(progressStep('cancelled')).toBe(-1);
  });

  it('tells what comes next while no repair company has the job', () => {
    const details = stepDetails(request({ source: 'tenant', progress: 'received', workOrder: null }), (iso) => iso ?? '');
    expect(details[0]).toBe('Your report arrived on 2026-03-02T08:00:00.000Z.');
    expect(details[1]).toBe('Your property manager is choosing a repair company.');
    expect(details[2]).toBe('The repair company will set a visit time with you.');
  });
});
