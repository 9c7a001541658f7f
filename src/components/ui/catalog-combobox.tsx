import { useId, useMemo, useState, type KeyboardEvent } from "react";
import { catalogKey, findCatalogEntry, type CatalogKind } from "@shared/machines/catalog.ts";
import { useCatalogChoices, type CatalogEntry } from "@/lib/machine-catalog.ts";
import { Field } from "./field.tsx";

type CatalogComboboxProps = {
  kind: CatalogKind;
  label: string;
  name: string;
  /** Uncontrolled start value; or pass value/onChange to control it (the directory fills it from a machine). */
  defaultValue?: string | undefined;
  value?: string;
  onChange?: (value: string) => void;
  error?: string | undefined;
  hint?: string | undefined;
  className?: string;
};

const MAX_SHOWN = 8;

/** Entries whose name or an alias contains what was typed, case and spacing aside; exact matches first. */
function suggestionsFor(entries: readonly CatalogEntry[], typed: string): CatalogEntry[] {
  const key = catalogKey(typed);
  if (key === "") return entries.slice(0, MAX_SHOWN);
  const exact = findCatalogEntry(entries, typed);
  const partial = entries.filter(
    (e) => e !== exact && [e.name, ...e.aliases].some((n) => catalogKey(n).includes(key)),
  );
  return (exact ? [exact, ...partial] : partial).slice(0, MAX_SHOWN);
}

type ControlProps = {
  id: string;
  name: string;
  className: string;
  disabled?: boolean | undefined;
  required?: boolean | undefined;
  "aria-invalid"?: true | undefined;
  "aria-describedby"?: string | undefined;
  "data-field"?: string;
};

type CatalogComboboxInputProps = {
  kind: CatalogKind;
  control: ControlProps;
  value: string;
  onChange: (value: string) => void;
};

/**
 * A text input that suggests builders or control families from the admin's catalog (WAI-ARIA combobox with a list
 * popup). Typing an alias in any case or spacing and leaving the field writes the catalog's own name, so records and
 * searches agree; a name the catalog lacks is kept as typed. For forms that lay out their own label.
 */
export function CatalogComboboxInput({ kind, control, value, onChange }: CatalogComboboxInputProps) {
  const entries = useCatalogChoices(kind);
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(-1);
  const listId = `${useId()}-list`;
  const shown = useMemo(() => suggestionsFor(entries, value), [entries, value]);
  const expanded = open && shown.length > 0;

  const choose = (entry: CatalogEntry) => {
    onChange(entry.name);
    setOpen(false);
    setActive(-1);
  };
  const onKeyDown = (event: KeyboardEvent<HTMLInputElement>) => {
    if (event.key === "ArrowDown") {
      event.preventDefault();
      setOpen(true);
      setActive((i) => Math.min(i + 1, shown.length - 1));
    } else if (event.key === "ArrowUp") {
      event.preventDefault();
      setActive((i) => Math.max(i - 1, 0));
    } else if (event.key === "Enter" && expanded && active >= 0 && shown[active]) {
      event.preventDefault();
      choose(shown[active]);
    } else if (event.key === "Escape" && open) {
      event.preventDefault();
      setOpen(false);
    }
  };
  const onBlur = () => {
    setOpen(false);
    const entry = findCatalogEntry(entries, value);
    if (entry && entry.name !== value) onChange(entry.name);
  };
  const typedKey = catalogKey(value);

  return (
    <div className="relative">
      <input
        {...control}
        type="text"
        role="combobox"
        autoComplete="off"
        aria-autocomplete="list"
        aria-expanded={expanded}
        aria-controls={listId}
        aria-activedescendant={expanded && active >= 0 ? `${listId}-${active}` : undefined}
        value={value}
        onChange={(event) => {
          onChange(event.currentTarget.value);
          setOpen(true);
          setActive(-1);
        }}
        onFocus={() => setOpen(true)}
        onBlur={onBlur}
        onKeyDown={onKeyDown}
      />
      <ul
        id={listId}
        role="listbox"
        aria-label="Catalog suggestions"
        hidden={!expanded}
        className="absolute z-20 mt-1 max-h-64 w-full overflow-auto rounded-md border border-ink-300 bg-white py-1 shadow-lg"
      >
        {shown.map((entry, i) => {
          const alias =
            typedKey === ""
              ? undefined
              : entry.aliases.find(
                  (a) => catalogKey(a).includes(typedKey) && !catalogKey(entry.name).includes(typedKey),
                );
          return (
            <li
              key={entry.id}
              id={`${listId}-${i}`}
              role="option"
              aria-selected={i === active}
              // mousedown, not click: the input's blur would close the list before a click lands.
              onMouseDown={(event) => {
                event.preventDefault();
                choose(entry);
              }}
              className={`cursor-pointer px-3 py-2 text-sm text-ink-900 ${i === active ? "bg-ink-100" : ""}`}
            >
              {entry.name}
              {alias && <span className="text-ink-700"> (also “{alias}”)</span>}
            </li>
          );
        })}
      </ul>
    </div>
  );
}

/** The catalog picker with its own label, hint and error. */
export function CatalogCombobox({
  kind,
  label,
  name,
  defaultValue,
  value: controlled,
  onChange,
  error,
  hint,
  className,
}: CatalogComboboxProps) {
  const [own, setOwn] = useState(defaultValue ?? "");
  const value = controlled ?? own;
  const setValue = (next: string) => {
    if (controlled === undefined) setOwn(next);
    onChange?.(next);
  };
  return (
    <Field label={label} name={name} error={error} hint={hint} className={className}>
      {(control) => <CatalogComboboxInput kind={kind} control={control} value={value} onChange={setValue} />}
    </Field>
  );
}
