// The organisation's working calendar: read by members, changed whole by owners from the version
// last read, and stored with each run so that the run's working days keep their dates.
import { afterAll, describe, expect, it } from 'vitest';
import { addMember, newOrganisation } from './helpers/http';
import { closeDb, rows } from './helpers/db';
import { projectWithRegisters, waitForRun } from './runs-fixtures';

afterAll(closeDb);

describe('working calendar', () => {
  it('starts as Monday to Friday, changes only by an owner and only from the version read', async () => {
    const { client: owner } = await newOrganisation('calendar-owner');
    const first = await owner.get('/api/calendar');
    expect(first.status).toBe(200);
    expect(first.json.calendar).toEqual({
      weekdays: [1, 2, 3, 4, 5],
      holidays: [],
      version: 0,
      customised: false,
    });

    const { client: estimator } = await addMember(owner, 'estimator');
    expect((await estimator.get('/api/calendar')).status).toBe(200);
    const refused = await estimator.put('/api/calendar', {
      weekdays: [1, 2, 3, 4],
      holidays: [],
      version: 0,
    });
    expect(refused.status).toBe(403);

    const twice = await owner.put('/api/calendar', {
      weekdays: [1, 2, 3, 4, 5],
      holidays: [
        { date: '2027-03-05', name: 'Founders day' },
        { date: '2027-03-05', name: 'Again' },
      ],
      version: 0,
    });
    expect(twice.status).toBe(400);
    expect(twice.json.error.issues).toContainEqual({
      path: 'holidays.1.date',
      message: '2027-03-05 is listed twice (also as holiday 1).',
    });

    const saved = await owner.put('/api/calendar', {
      weekdays: [5, 1, 2, 3, 4],
      holidays: [
        { date: '2027-03-08', name: 'Spring closure' },
        { date: '2027-03-05', name: 'Founders day' },
      ],
      version: 0,
    });
    expect(saved.status).toBe(200);
    expect(saved.json.calendar).toEqual({
      weekdays: [1, 2, 3, 4, 5],
      holidays: [
        { date: '2027-03-05', name: 'Founders day' },
        { date: '2027-03-08', name: 'Spring closure' },
      ],
      version: 1,
      customised: true,
    });

    const stale = await owner.put('/api/calendar', { weekdays: [1, 2, 3, 4], holidays: [], version: 0 });
    expect(stale.status).toBe(409);
    expect(stale.json.error.details.current.version).toBe(1);
    expect((await owner.get('/api/calendar')).json.calendar.holidays).toHaveLength(2);
  });

  it('counts a run’s finish target on the calendar and keeps that calendar with the run', async () => {
    const { client } = await newOrganisation('calendar-runs');
    const projectId = await projectWithRegisters(client); // base date Monday 2027-03-01
    const read = (await client.get('/api/calendar')).json.calendar;
    await client.put('/api/calendar', {
      weekdays: [1, 2, 3, 4, 5],
      holidays: [
        { date: '2027-03-05', name: '' },
        { date: '2027-03-08', name: '' },
        { date: '2027-02-26', name: 'before the base date' },
      ],
      version: read.version,
    });

    const started = await client.post(`/api/projects/${projectId}/runs`, {
      iterations: 1000,
      seed: 7,
      finishTarget: '2027-03-12',
    });
    expect(started.status).toBe(201);
    const runId = started.json.run.id;
    // Counted by hand: Mon 1 – Thu 4 March = 4; Fri 5 and Mon 8 off; Tue 9 – Fri 12 = 4 more.
    expect(started.json.run.settings.durationTarget).toBe(8);
    expect(started.json.run.settings.calendar).toEqual({
      weekdays: [1, 2, 3, 4, 5],
      holidays: ['2027-03-05', '2027-03-08'],
    });
    await waitForRun(client, projectId, runId, (r) => r.status === 'succeeded');

    // A later change of the calendar leaves the stored run as it was.
    const now = (await client.get('/api/calendar')).json.calendar;
    expect(
      (await client.put('/api/calendar', { weekdays: [1, 2, 3, 4], holidays: [], version: now.version }))
        .status,
    ).toBe(200);
    const [stored] = await rows<{ settings: string }>('SELECT settings FROM SimulationRuns WHERE id = ?', [
      runId,
    ]);
    const settings = typeof stored.settings === 'string' ? JSON.parse(stored.settings) : stored.settings;
    expect(settings.durationTarget).toBe(8);
    expect(settings.calendar.holidays).toEqual(['2027-03-05', '2027-03-08']);
  });
});
