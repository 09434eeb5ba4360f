/** A form-level message: an error (announced at once) or a plain note. */
export function FormMessage({ error, children }: { error?: boolean; children: React.ReactNode }) {
  if (!children) return null;
  return (
    <div
      role={error ? 'alert' : 'status'}
      className={`rounded-lg border-2 px-4 py-3 font-medium ${error ? 'border-danger bg-danger-soft text-danger' : 'border-accent bg-accent-soft text-ink'}`}
    >
      {children}
    </div>
  );
}
