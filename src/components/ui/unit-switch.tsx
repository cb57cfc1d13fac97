import { ENERGY_UNITS, LENGTH_UNITS, type EnergyUnit, type LengthUnit } from '@shared/physics/parameter-units';

/** Choose the units ε and σ are shown in. */
export function UnitSwitch({
  energy,
  length,
  onChange,
}: {
  energy: EnergyUnit;
  length: LengthUnit;
  onChange: (u: { energy: EnergyUnit; length: LengthUnit }) => void;
}) {
  return (
    <div className="flex flex-wrap items-center gap-3 text-sm">
      <fieldset className="flex items-center gap-1" aria-label="Energy unit">
        <legend className="sr-only">Energy unit</legend>
        <span className="mr-1 text-ink-faint">ε in</span>
        {ENERGY_UNITS.map((u) => (
          <label
            key={u}
            className={`cursor-pointer rounded px-2 py-0.5 font-semibold has-[:focus-visible]:ring-2 has-[:focus-visible]:ring-copper ${u === energy ? 'bg-ink text-paper' : 'text-ink-soft hover:bg-paper-deep'}`}
          >
            <input
              type="radio"
              name="energy-unit"
              value={u}
              checked={u === energy}
              onChange={() => onChange({ energy: u, length })}
              className="sr-only"
            />
            {u}
          </label>
        ))}
      </fieldset>
      <fieldset className="flex items-center gap-1" aria-label="Length unit">
        <legend className="sr-only">Length unit</legend>
        <span className="mr-1 text-ink-faint">σ in</span>
        {LENGTH_UNITS.map((u) => (
          <label
            key={u}
            className={`cursor-pointer rounded px-2 py-0.5 font-semibold has-[:focus-visible]:ring-2 has-[:focus-visible]:ring-copper ${u === length ? 'bg-ink text-paper' : 'text-ink-soft hover:bg-paper-deep'}`}
          >
            <input
              type="radio"
              name="length-unit"
              value={u}
              checked={u === length}
              onChange={() => onChange({ energy, length: u })}
              className="sr-only"
            />
            {u}
          </label>
        ))}
      </fieldset>
    </div>
  );
}
