// The cautions README.md asks the product to show wherever plans and rosters are shown.
export const CAUTIONS = [
  "A post plan is a sightline aid, not a security risk assessment; CCTV, alarms and local requirements are outside it.",
  "Posts must never block exits, evacuation routes or fire-safety equipment; local fire and building codes govern.",
  "Labour rules are defaults; local law, collective agreements and contracts govern.",
] as const;

export function Cautions() {
  return (
    <footer className="mt-section border-t border-stone-300 bg-stone-100">
      <section aria-labelledby="cautions-heading" className="mx-auto max-w-page px-4 py-6 text-sm text-stone-800">
        <h2 id="cautions-heading" className="mb-2 text-base">Cautions</h2>
        <ul className="list-disc space-y-1 pl-5">
          {CAUTIONS.map((caution) => (
            <li key={caution}>{caution}</li>
          ))}
        </ul>
      </section>
    </footer>
  );
}
