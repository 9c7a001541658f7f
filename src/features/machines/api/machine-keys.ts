export type MachineFilters = {
  siteId?: number | undefined;
  builder?: string | undefined;
  technology?: string | undefined;
  state?: string | undefined;
};

export const machineKeys = {
  all: ["machines"] as const,
  list: (filters: MachineFilters) => [...machineKeys.all, "list", filters] as const,
  detail: (id: number) => [...machineKeys.all, "detail", id] as const,
  history: (id: number) => [...machineKeys.all, "history", id] as const,
  downtime: (id: number) => [...machineKeys.all, "downtime", id] as const,
  builders: () => [...machineKeys.all, "builders"] as const,
};

/** Downloads and the printable page are served by the API itself, so they are plain links. */
export const machineHistoryCsvUrl = (id: number) => `/api/machines/${id}/history.csv`;
export const machineHistoryPrintUrl = (id: number) => `/api/machines/${id}/history/print`;
