export function FieldMessage({ id, message }: { id: string; message: string | undefined }) {
  if (!message) return null;
  return (
    <p id={id} className="mt-1 text-caption font-semibold text-ember-700">
      {message}
    </p>
  );
}
