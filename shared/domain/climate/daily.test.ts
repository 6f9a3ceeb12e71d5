import { describe, expect, it } from 'vitest';
import {
  dailyMail,
  dayOutOfRange,
  describeDay,
  mergeRoomAlerts,
  roomAlerts,
  summariseByDay,
} from './daily';

const targets = { minCelsius: 24, maxCelsius: 28, minHumidity: 60, maxHumidity: 80 };
const logger = (takenAt: string, c: number, h: number) => ({
  takenAt,
  currentCelsius: c,
  minCelsius: null,
  maxCelsius: null,
  humidity: h,
});

describe('summariseByDay', () => {
  it('sums a logger’s rows up per local day in the collection’s zone', () => {
    const days = summariseByDay(
      [
        logger('2026-07-01T21:00:00Z', 25, 70),
        logger('2026-07-01T22:30:00Z', 23, 72), // 00:30 on 2 July in Amsterdam (+02:00)
        logger('2026-07-02T10:00:00Z', 27.5, 65),
      ],
      'Europe/Amsterdam',
    );
    expect(days).toEqual([
      {
        date: '2026-07-01',
        lowCelsius: 25,
        highCelsius: 25,
        lowHumidity: 70,
        highHumidity: 70,
        readings: 1,
      },
      {
        date: '2026-07-02',
        lowCelsius: 23,
        highCelsius: 27.5,
        lowHumidity: 65,
        highHumidity: 72,
        readings: 2,
      },
    ]);
    expect(describeDay(days[1]!, 'C')).toBe('23.0–27.5 °C · 65–72 %');
    // 23 °C is below 24 °C; the first day (25 °C, 70 %) is inside 24–28 °C and 60–80 %.
    expect(dayOutOfRange(days[1]!, targets)).toBe(true);
    expect(dayOutOfRange(days[0]!, targets)).toBe(false);
  });
});

describe('roomAlerts and the daily e-mail', () => {
  it('keeps each breach once at its worst, and says nothing without one', () => {
    const alerts = roomAlerts([
      {
        room: 'Spare room',
        targets,
        readings: [
          logger('2026-07-01T12:00:00Z', 29, 70),
          logger('2026-07-01T13:00:00Z', 31, 70),
          logger('2026-07-01T14:00:00Z', 30, 55),
        ],
      },
      { room: 'Hall', targets, readings: [logger('2026-07-01T12:00:00Z', 25, 70)] },
    ]);
    expect(alerts).toHaveLength(1);
    expect(alerts[0]!.breaches.map((b) => [b.measure, b.value, b.takenAt])).toEqual([
      ['temperature', 31, '2026-07-01T13:00:00Z'],
      ['humidity', 55, '2026-07-01T14:00:00Z'],
    ]);
    const mail = dailyMail({
      collectionName: 'Ana’s invertebrates',
      date: '2026-07-02',
      alerts,
      unit: 'F',
      link: 'http://x/places',
    });
    expect(mail!.subject).toBe('Ana’s invertebrates: a room was out of range');
    // 31 °C = 87.8 °F; 24–28 °C = 75.2–82.4 °F (t/°F = 1.8 · t/°C + 32, NIST SP 811, 2008).
    expect(mail!.text).toContain(
      '- Spare room: up to 87.8 °F, above the range 75.2–82.4 °F; humidity 55 %, below the range 60–80 %.',
    );
    expect(
      dailyMail({ collectionName: 'x', date: '2026-07-02', alerts: [], unit: 'C', link: '' }),
    ).toBeNull();
  });
});

describe('mergeRoomAlerts', () => {
  // The server's alerts and the phone's unsent readings as one notice: each room once, each
  // broken bound once at its worst (the rule roomAlerts keeps, decision 019; reporting the
  // worst value per bound is common practice, no published source).
  it('keeps each room and each bound once, at its worst', () => {
    const targets = { minCelsius: 22, maxCelsius: 27, minHumidity: 60, maxHumidity: 75 };
    const server = roomAlerts([
      {
        room: 'Spare room',
        targets,
        readings: [
          { takenAt: 'a', minCelsius: 23, maxCelsius: 29, currentCelsius: null, humidity: 55 },
        ],
      },
    ]);
    const phone = roomAlerts([
      {
        room: 'Spare room',
        targets,
        readings: [
          { takenAt: 'b', minCelsius: 23, maxCelsius: 30.5, currentCelsius: null, humidity: 58 },
        ],
      },
      {
        room: 'Attic',
        targets,
        readings: [
          { takenAt: 'c', minCelsius: 21, maxCelsius: 24, currentCelsius: null, humidity: null },
        ],
      },
    ]);
    expect(
      mergeRoomAlerts(server, phone).map((a) => [
        a.room,
        a.breaches.map((b) => `${b.measure} ${b.side} ${b.value} ${b.takenAt}`),
      ]),
    ).toEqual([
      ['Attic', ['temperature low 21 c']],
      ['Spare room', ['temperature high 30.5 b', 'humidity low 55 a']],
    ]);
    expect(mergeRoomAlerts(server, [])).toEqual(server);
  });
});
