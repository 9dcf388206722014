import { DEFAULT_ORGANISATION_SETTINGS } from '@plummet/shared';
import { describe, expect, it } from 'vitest';
import { defaultSeverityRows, readSettingsForm, settingsFormOf } from './settings-form';

describe('the organisation settings form', () => {
  it('sends every setting, with Plummet’s bands as null', () => {
    const read = readSettingsForm(settingsFormOf(DEFAULT_ORGANISATION_SETTINGS));
    expect(read.ok).toBe(true);
    if (read.ok) expect(read.body).toMatchObject({ fixDueHours: { High: 24, Medium: 72 }, digestHour: 6, severityTable: null, defaultUnits: 'si' });
  });

  it('answers each bad value with the shared schema’s message on its field', () => {
    const form = { ...settingsFormOf(DEFAULT_ORGANISATION_SETTINGS), fixDueHigh: '0', fixDueMedium: '1.5', digestHour: '24', shiftEndsAt: '5pm', timeZone: 'Mars/Olympus' };
    const read = readSettingsForm(form);
    expect(read.ok).toBe(false);
    if (!read.ok) {
      expect(read.errors).toEqual({
        'fixDueHours.High': 'At least 1 hour',
        'fixDueHours.Medium': 'Whole hours',
        digestHour: 'To 23',
        shiftEndsAt: 'A time of day as HH:MM, e.g. 17:00',
        timeZone: 'Unknown time zone',
      });
    }
  });

  it('puts the severity validator’s message on the threshold it is about', () => {
    const rows = defaultSeverityRows();
    rows.helmet[1] = { ...rows.helmet[1]!, atLeast: '-5' };
    const read = readSettingsForm({ ...settingsFormOf(DEFAULT_ORGANISATION_SETTINGS), severity: rows });
    expect(read).toEqual({ ok: false, errors: { 'severityTable.helmet.1.atLeast': 'A threshold value must be a positive finite number.' } });
    rows.helmet[1] = { ...rows.helmet[1]!, atLeast: '60', source: ' ' };
    const noSource = readSettingsForm({ ...settingsFormOf(DEFAULT_ORGANISATION_SETTINGS), severity: rows });
    expect(noSource).toEqual({ ok: false, errors: { 'severityTable.helmet.1.source': 'Every threshold needs its source.' } });
  });

  it('sends an organisation’s own bands as a table the physics accepts', () => {
    const read = readSettingsForm({ ...settingsFormOf(DEFAULT_ORGANISATION_SETTINGS), severity: defaultSeverityRows() });
    expect(read.ok).toBe(true);
  });
});
