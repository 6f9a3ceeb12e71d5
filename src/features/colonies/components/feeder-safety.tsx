/**
 * The usual cautions for feeder colonies (common practice, no published source): insect frass
 * and shed skins are a known cause of allergy in people who keep feeders, and crickets escape.
 */
export function FeederSafety() {
  return (
    <aside aria-label="Safety" className="rounded-xl border-2 border-border p-3 text-sm">
      <p>
        Frass, dust and shed skins from feeder colonies can cause allergies and asthma: clean bins
        with gloves and a dust mask, away from food, and wash your hands after. Keep lids fitted:
        crickets escape and some roach species climb smooth sides.
      </p>
    </aside>
  );
}
