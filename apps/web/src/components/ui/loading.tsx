/** A polite "loading" line; text, not a spinner, so it reads the same to everyone. */
export function Loading({ label = 'Loading…' }: { label?: string }) {
  return (
    <p role="status" className="py-6 text-lg text-thread-soft">
      {label}
    </p>
  );
}
