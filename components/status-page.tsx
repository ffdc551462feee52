// A full-page message (404, 403, errors) in the house style, with a main landmark of its own.
export function StatusPage({ code, title, children }: { code: string; title: string; children: React.ReactNode }) {
  return (
    <main id="main" className="flex min-h-[60vh] items-center justify-center px-4 py-section">
      <div className="card max-w-lg">
        <p className="text-sm font-semibold uppercase tracking-widest text-brass-700">{code}</p>
        <h1 className="mb-3">{title}</h1>
        <div className="text-stone-800">{children}</div>
      </div>
    </main>
  );
}
