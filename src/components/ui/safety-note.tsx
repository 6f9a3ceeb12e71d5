/** The standing safety words: shown on sign-in, settings and, later, to every helper. */
export function SafetyNote() {
  return (
    <aside aria-label="Safety" className="rounded-xl border-2 border-border p-3 text-sm text-muted">
      <p>
        Rackside gives husbandry reminders, not veterinary or medical advice. Some species need a
        licence or permit where you live: local law and licensed practice come first. After a bite
        or sting, seek medical advice.
      </p>
    </aside>
  );
}
