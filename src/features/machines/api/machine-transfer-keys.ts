/** Keys for machine transfers and photos, general to specific, so one prefix refreshes a whole family. */
export const machineTransferKeys = {
  all: ["machine-transfers"] as const,
  list: () => [...machineTransferKeys.all, "list"] as const,
  ofMachine: (machineId: number) => [...machineTransferKeys.all, "machine", machineId] as const,
};

export const machinePhotoKeys = {
  all: ["machine-photos"] as const,
  ofMachine: (machineId: number) => [...machinePhotoKeys.all, machineId] as const,
};
