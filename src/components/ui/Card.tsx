export function Card({ children, className = '' }: { children: React.ReactNode; className?: string }) {
  return <section className={`rounded-card border border-line/60 bg-card p-4 shadow-xs sm:p-6 ${className}`}>{children}</section>;
}
