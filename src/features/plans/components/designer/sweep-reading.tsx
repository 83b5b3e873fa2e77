import { formatQuantity, type UnitSystem } from "@/lib/units";

/**
 * How to read the design sweep: the colour is the worst verdict over all refractors, and with
 * the channel count fixed a finer spacing also shortens the spread.
 */
export function SweepReading({
  axis,
  channels,
  spacing,
  units,
}: {
  axis: "spacing" | "channels";
  channels: number;
  spacing: number;
  units: UnitSystem;
}) {
  return (
    <div className="mt-2 space-y-1 text-xs text-ink-soft" aria-label="Reading the sweep">
      <p>
        Each cell&rsquo;s colour is the worst verdict over all refractors of this model (and the
        direct wave), not the verdict of the swept layer alone.
      </p>
      {axis === "spacing" ? (
        <p role="note">
          The channel count stays at {channels}, so the spread is (channels − 1) × spacing long: a
          finer spacing also shortens the spread (now{" "}
          {formatQuantity("length", (channels - 1) * spacing, units)}). A fine column can read
          under-sampled because a deep refractor&rsquo;s segment falls beyond the shorter spread,
          not because the spacing is too coarse; sweep channels, or use Apply&rsquo;s &ldquo;keep
          spacing&rdquo;, to see the spacing alone.
        </p>
      ) : (
        <p>
          The spacing stays at {formatQuantity("length", spacing, units)}; more channels lengthen
          the spread. Anchored shots follow the spread&rsquo;s start, end or centre.
        </p>
      )}
    </div>
  );
}
