import type { SyncStatus } from '@/lib/sync';

export interface SyncText {
  words: string;
  symbol: string;
  tone: 'calm' | 'waiting' | 'alert';
  /** Why taps are waiting, in a sentence, when the last try got no verdict on them. */
  detail: string | null;
}

const taps = (n: number) => (n === 1 ? '1 tap' : `${n} taps`);

function ago(iso: string, now: Date): string {
  const minutes = Math.floor((now.getTime() - new Date(iso).getTime()) / 60_000);
  if (minutes < 1) return 'just now';
  if (minutes < 60) return `${minutes} min ago`;
  const hours = Math.floor(minutes / 60);
  return hours < 24 ? `${hours} h ago` : `${Math.floor(hours / 24)} d ago`;
}

/** The indicator's words: "Offline · 7 waiting", "Saving 7…", "All saved · 2 min ago", "3 need attention". */
export function describeSync(s: SyncStatus, now: Date): SyncText {
  const detail =
    s.waiting > 0 && s.phase === 'failing' && s.reason
      ? `${s.reason} Your taps stay on this phone and are sent again by themselves.`
      : null;
  if (s.phase === 'signed_out')
    return {
      words: `Sign in again to save ${taps(s.waiting)}`,
      symbol: '⚠',
      tone: 'alert',
      detail: null,
    };
  if (s.phase === 'starting')
    return { words: 'Checking taps…', symbol: '↻', tone: 'waiting', detail: null };
  if (s.attention > 0)
    return {
      words: `${s.attention} need${s.attention === 1 ? 's' : ''} attention`,
      symbol: '⚠',
      tone: 'alert',
      detail,
    };
  if (s.phase === 'saving')
    return {
      words: `Saving ${s.progress?.total ?? s.waiting}…`,
      symbol: '↻',
      tone: 'waiting',
      detail: null,
    };
  if (s.waiting > 0) {
    const why =
      s.phase === 'failing' ? 'Server trouble' : s.phase === 'offline' ? 'Offline' : 'Not sent yet';
    return { words: `${why} · ${s.waiting} waiting`, symbol: '●', tone: 'waiting', detail };
  }
  return {
    words: s.lastSavedAt ? `All saved · ${ago(s.lastSavedAt, now)}` : 'All saved',
    symbol: '✓',
    tone: 'calm',
    detail: null,
  };
}
