import { Alert } from '../../../components/ui/alert.tsx';

/** The librarian's notes on a returned bundle, shown where the seller will act on them. */
export function ReviewNotes({ notes, title = 'The librarian sent this bundle back with a note' }: { notes: string; title?: string }) {
  return (
    <Alert tone="warning" title={title} announce={false}>
      <blockquote className="border-l-4 border-ochre pl-3 text-lg whitespace-pre-line">{notes}</blockquote>
      <p>Change what the note asks for, then submit the bundle for review again.</p>
    </Alert>
  );
}
