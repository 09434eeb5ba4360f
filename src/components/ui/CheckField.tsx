/** A labelled checkbox with a hint and an error beside it. */
export function CheckField({ label, hint, checked, onChange, error }: { label: string; hint: string; checked: boolean; onChange: (v: boolean) => void; error?: string }) {
  return (
    <label className="flex items-start gap-3">
      <input type="checkbox" checked={checked} onChange={(e) => onChange(e.target.checked)} className="mt-1 h-6 w-6 shrink-0 accent-accent" aria-invalid={error ? true : undefined} />
      <span>
        <span className="font-medium">{label}</span>
        <span className="block text-base text-ink-soft">{hint}</span>
        {error && <span className="block font-medium text-danger">✕ {error}</span>}
      </span>
    </label>
  );
}
