import { fieldErrorsOf, formMessageOf } from "@/lib/field-errors.ts";

type FormErrorProps = {
  /** A ZodError from the client-side parse or an ApiError from the server; nothing renders when empty. */
  error: unknown;
  /** Field path to the label the user sees, so the summary names fields as the form does. */
  labels?: Readonly<Record<string, string>>;
  /** Plain messages for client-side problems, as passed to `fieldErrorsOf`. */
  plainWords?: Readonly<Record<string, string>>;
};

/**
 * The summary above a form: the overall message and every field problem, each linking to its input.
 * Announced once when it appears (role="alert"); the fields carry their own messages too.
 */
export function FormError({ error, labels = {}, plainWords = {} }: FormErrorProps) {
  const message = formMessageOf(error);
  if (!message) return null;
  const fields = Object.entries(fieldErrorsOf(error, plainWords));
  return (
    <div
      role="alert"
      className="rounded-md border-l-4 border-red-700 bg-red-50 px-4 py-3 text-sm text-red-900"
    >
      <p className="font-semibold">{message}</p>
      {fields.length > 0 && (
        <ul className="mt-1 list-disc space-y-0.5 pl-5">
          {fields.map(([path, text]) => (
            <li key={path}>
              <a
                href={`#${path}`}
                className="underline underline-offset-2 focus-visible:outline-2 focus-visible:outline-ink-700"
                onClick={(event) => {
                  event.preventDefault();
                  document.querySelector<HTMLElement>(`[data-field="${CSS.escape(path)}"]`)?.focus();
                }}
              >
                {labels[path] ?? path}
              </a>
              : {text}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
