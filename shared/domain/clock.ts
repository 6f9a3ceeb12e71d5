/**
 * Device clocks are not trusted: an event's effective time is the device's recorded time moved
 * by the batch's clock offset (server received − device sent), so a phone whose clock runs ten
 * minutes slow still files its taps at the right moment.
 */
export const CLOCK_FLAGS = [
  'clock_corrected',
  'future_clamped',
  'recorded_after_sent',
  'very_old',
] as const;
export type ClockFlag = (typeof CLOCK_FLAGS)[number];

/** Offsets under this are network latency, not a wrong clock. */
const SKEW_MS = 2 * 60_000;
/** Queues can be days old; older than this is worth a second look. */
const OLD_MS = 30 * 86_400_000;

export function clockOffsetMs(clientSentAt: Date, serverReceivedAt: Date): number {
  return serverReceivedAt.getTime() - clientSentAt.getTime();
}

export function effectiveTime(
  clientRecordedAt: Date,
  clientSentAt: Date,
  serverReceivedAt: Date,
): { effectiveAt: Date; flags: ClockFlag[] } {
  const offset = clockOffsetMs(clientSentAt, serverReceivedAt);
  const flags: ClockFlag[] = [];
  if (Math.abs(offset) > SKEW_MS) flags.push('clock_corrected');
  // A tap cannot happen after the request that carries it was sent.
  if (clientRecordedAt.getTime() > clientSentAt.getTime() + SKEW_MS)
    flags.push('recorded_after_sent');
  let effective = clientRecordedAt.getTime() + offset;
  if (effective > serverReceivedAt.getTime()) {
    if (effective - serverReceivedAt.getTime() > SKEW_MS) flags.push('future_clamped');
    effective = serverReceivedAt.getTime();
  }
  if (serverReceivedAt.getTime() - effective > OLD_MS) flags.push('very_old');
  return { effectiveAt: new Date(effective), flags };
}
