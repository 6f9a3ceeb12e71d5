import { useMemo } from 'react';
import { drawPrepList } from '#shared/domain/colonies/stock';
import type { PrepLineView } from '#shared/schemas/rounds';
import { useColonies } from '@/features/colonies/api/colonies-api';
import { PrepList } from '@/features/rounds/components/prep-list';

/**
 * The prep list with the feeder colonies' draw (docs/care-rules.md § Feeder colonies): which
 * colony each line is pulled from, and a warning when they hold too few. A collection without
 * colonies, or a phone that never fetched them, shows the plain list.
 */
export function PrepListPanel({
  collectionId,
  lines,
}: {
  collectionId: string;
  lines: PrepLineView[];
}) {
  const colonies = useColonies(collectionId);
  const drawn = useMemo(() => {
    const list = colonies.data?.colonies ?? [];
    if (!list.length) return lines;
    return drawPrepList(
      lines,
      list.map((c) => ({
        id: c.id,
        name: c.name,
        preyType: c.preyType,
        stock: Object.fromEntries(c.stock.map((s) => [s.preySize, s.count])),
      })),
    );
  }, [colonies.data, lines]);
  return <PrepList lines={drawn} />;
}
