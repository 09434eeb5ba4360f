export function Card({ children, className = '' }: { children: React.ReactNode; className?: string }) {
  return <section className={`rounded-card border border-line/60 bg-card p-6 shadow-xs ${className}`}>{children}</section>;
}
