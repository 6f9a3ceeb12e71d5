export interface Place {
  room: string;
  rack: string;
  shelf: string;
  position: string;
  walkOrder: number;
}

// Natural sort: "2" before "10", "C1-02" before "C1-10" (R14).
const collator = new Intl.Collator('en', { numeric: true, sensitivity: 'base' });

/**
 * R14 walk order: room → rack → shelf → position by natural sort; the keeper's own walk order
 * breaks ties and can override (a lower walkOrder comes first when set differently).
 */
export function compareLocations(a: Place | null, b: Place | null): number {
  if (!a || !b) return a ? -1 : b ? 1 : 0;
  if (a.walkOrder !== b.walkOrder) return a.walkOrder - b.walkOrder;
  return (
    collator.compare(a.room, b.room) ||
    collator.compare(a.rack, b.rack) ||
    collator.compare(a.shelf, b.shelf) ||
    collator.compare(a.position, b.position)
  );
}
