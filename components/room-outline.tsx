// A small drawing of a room: outline filled, obstacles cut out (even-odd), north (y up) at the top.
import type { Ring } from "@/lib/geometry/types";

function ringPath(ring: Ring): string {
  return ring.map(([x, y], i) => `${i === 0 ? "M" : "L"}${x} ${-y}`).join(" ") + " Z";
}

export function RoomOutline({ outline, obstacles, label, size = 96 }: { outline: Ring; obstacles: Ring[]; label: string; size?: number }) {
  if (outline.length < 3) return null;
  const xs = outline.map(([x]) => x);
  const ys = outline.map(([, y]) => -y);
  const minX = Math.min(...xs);
  const minY = Math.min(...ys);
  const width = Math.max(...xs) - minX || 1;
  const height = Math.max(...ys) - minY || 1;
  const pad = Math.max(width, height) * 0.05;
  return (
    <svg
      role="img"
      aria-label={label}
      width={size}
      height={size}
      viewBox={`${minX - pad} ${minY - pad} ${width + 2 * pad} ${height + 2 * pad}`}
      className="shrink-0 rounded-md bg-stone-100"
    >
      <path
        d={[outline, ...obstacles].map(ringPath).join(" ")}
        fillRule="evenodd"
        className="fill-ink-100 stroke-ink-700"
        strokeWidth={Math.max(width, height) * 0.015}
        strokeLinejoin="round"
      />
    </svg>
  );
}
