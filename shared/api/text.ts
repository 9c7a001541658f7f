import { z } from "zod";

/**
 * Text as people type it. PostgreSQL cannot store a NUL in text or JSON, a lone UTF-16 surrogate is not a character at
 * all, and other control characters only hide or reorder what a reader sees: all are refused where the input enters,
 * naming the field, instead of failing later as a server error. Tab and line feed are kept where a field may span
 * several lines; a carriage return before a line feed (CRLF from a textarea) becomes a plain line feed.
 */
// C0 controls, DEL and C1 controls (Unicode general category Cc): matching them is the point.
/* eslint-disable no-control-regex */
const CONTROL = /[\u0000-\u001F\u007F-\u009F]/;
const CONTROL_EXCEPT_TAB_NEWLINE = /[\u0000-\u0008\u000B-\u001F\u007F-\u009F]/;
/* eslint-enable no-control-regex */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

export const CONTROL_CHARACTER_MESSAGE = "Remove control characters (such as NUL) from this text";
export const MULTILINE_CONTROL_CHARACTER_MESSAGE =
  "Remove control characters (such as NUL) from this text; only tabs and line breaks may stay";
export const BROKEN_CHARACTER_MESSAGE = "This text holds a broken character (an unpaired surrogate)";

export const hasControlCharacter = (s: string) => CONTROL.test(s);
export const hasLoneSurrogate = (s: string) => LONE_SURROGATE.test(s);
/** Lone surrogates replaced by U+FFFD, so the text can be encoded as UTF-8 (for names that are kept, not refused). */
export const withoutLoneSurrogates = (s: string) =>
  s.replace(new RegExp(LONE_SURROGATE.source, "g"), "\uFFFD");

/** One line of text: no control character at all (no tab, no line break). Chain `.trim().min().max()` as usual. */
export const singleLineText = () =>
  z
    .string()
    .refine((s) => !CONTROL.test(s), CONTROL_CHARACTER_MESSAGE)
    .refine((s) => !LONE_SURROGATE.test(s), BROKEN_CHARACTER_MESSAGE);

/** Several lines: tabs and line feeds allowed, CRLF normalised to LF, any other control character refused. */
export const multiLineText = () =>
  z
    .string()
    .overwrite((s) => s.replace(/\r\n/g, "\n"))
    .refine((s) => !CONTROL_EXCEPT_TAB_NEWLINE.test(s), MULTILINE_CONTROL_CHARACTER_MESSAGE)
    .refine((s) => !LONE_SURROGATE.test(s), BROKEN_CHARACTER_MESSAGE);
