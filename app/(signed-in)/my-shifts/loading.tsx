export default function Loading() {
  return (
    <p role="status" className="py-section text-stone-700">
      Loading…
    </p>
  );
}
