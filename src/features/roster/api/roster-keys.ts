export const rosterKeys = {
  all: ["roster"] as const,
  list: () => [...rosterKeys.all, "list"] as const,
};

/** The CSV download is a plain link: the browser saves the file with the session cookie. */
export const rosterExportUrl = "/api/roster/export.csv";
