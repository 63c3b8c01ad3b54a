/** Says which role an action needs, where the action's button is disabled. The server enforces it either way. */
export function RoleNote({ sentence }: { sentence: string }) {
  return (
    <p role="note" data-testid="role-refusal" className="mb-4 flex gap-2 rounded-md border border-amber/40 bg-amber-wash px-4 py-2 text-sm text-ink">
      <span aria-hidden className="font-mono text-amber">
        ⊘
      </span>
      <span>{sentence}</span>
    </p>
  );
}
