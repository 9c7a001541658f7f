/** Every URL the client links to or routes on. */
export const paths = {
  home: "/",
  auth: {
    signIn: "/sign-in",
    signUp: "/sign-up",
    forgotPassword: "/forgot-password",
    setPassword: "/set-password",
    /** The broker's one-time upload page, opened from the e-mailed link without an account. */
    brokerUpload: "/broker-upload/:token",
  },
  account: "/account",
  company: "/company",
  /** Role-neutral links in e-mails; each role is sent on to its own page. */
  mailLinks: {
    documents: "/documents",
    documentNew: "/documents/new",
  },
  provider: {
    dashboard: "/provider",
    technicians: "/provider/technicians",
    technicianNew: "/provider/technicians/new",
    techniciansImport: "/provider/technicians/import",
    technician: "/provider/technicians/:technicianId",
    technicianEdit: "/provider/technicians/:technicianId/edit",
    documents: "/provider/documents",
    documentNew: "/provider/documents/new",
    workOrders: "/provider/work-orders",
    serviceRequests: "/provider/service-requests",
    serviceRequest: "/provider/service-requests/:requestId",
    gateChecks: "/provider/gate-checks",
    brokers: "/provider/brokers",
  },
  technician: {
    standing: "/technician",
    uploadCard: "/technician/upload-card",
    badge: "/badge",
  },
  reviewer: {
    queue: "/review",
    review: "/review/:credentialId",
  },
  buyer: {
    directory: "/directory",
    roster: "/roster",
    sites: "/sites",
    gateSign: "/sites/:siteId/gate-sign",
    requirementSets: "/requirement-sets",
    workOrders: "/work-orders",
    technician: "/directory/technicians/:technicianId",
    workOrderNew: "/work-orders/new",
    serviceRequests: "/buyer/service-requests",
    serviceRequestNew: "/buyer/service-requests/new",
    serviceRequest: "/buyer/service-requests/:requestId",
    machines: "/machines",
    machine: "/machines/:machineId",
    machineTransfer: "/machines/:machineId/transfer",
    /** A machine the shop sold: its read-only copy of the history up to the handover. */
    machineCopy: "/machines/:machineId/copy",
    machineTransfers: "/machine-transfers",
    machinesImport: "/machines/import",
    machineMaintenance: "/machines/:machineId/maintenance",
    gateChecks: "/gate-checks",
    certificateRequests: "/certificate-requests",
  },
  /** Where a scanned gate badge opens; public. */
  gateCheck: "/gate/check",
  /** One work order, for either side (the e-mails link here). */
  workOrder: "/work-orders/:workOrderId",
  admin: {
    users: "/admin/users",
    catalog: "/admin/catalog",
    outbox: "/admin/outbox",
    baseline: "/admin/baseline",
    jobRuns: "/admin/job-runs",
    reportedReviews: "/admin/reviews",
    followUp: "/admin/follow-up",
    companies: "/admin/companies",
    machineCatalog: "/admin/machine-catalog",
  },
} as const;

/** Links to pages with parameters; the patterns above are what the router matches. */
export const hrefs = {
  technician: (id: number) => `/provider/technicians/${id}`,
  technicianEdit: (id: number) => `/provider/technicians/${id}/edit`,
  review: (credentialId: number) => `/review/${credentialId}`,
  directoryTechnician: (id: number) => `/directory/technicians/${id}`,
  workOrder: (id: number) => `/work-orders/${id}`,
  gateSign: (siteId: number) => `/sites/${siteId}/gate-sign`,
  buyerServiceRequest: (id: number) => `/buyer/service-requests/${id}`,
  machineMaintenance: (machineId: number) => `/machines/${machineId}/maintenance`,
  providerServiceRequest: (id: number) => `/provider/service-requests/${id}`,
  machine: (id: number) => `/machines/${id}`,
  machineTransfer: (machineId: number) => `/machines/${machineId}/transfer`,
  machineCopy: (machineId: number) => `/machines/${machineId}/copy`,
  /** With the site the buyer searched from, so the work order starts on that site and its requirement set. */
  workOrderNew: (technicianId: number, siteId?: number | null) =>
    `/work-orders/new?technicianId=${technicianId}${siteId ? `&siteId=${siteId}` : ""}`,
  /** The upload flow with the type and holder chosen already (a renewal, or a corrected returned document). */
  documentNew: (preset: { typeCode?: string | undefined; technicianId?: number | null | undefined } = {}) => {
    const query = new URLSearchParams();
    if (preset.typeCode) query.set("type", preset.typeCode);
    if (preset.technicianId) query.set("technicianId", String(preset.technicianId));
    const search = query.toString();
    return search ? `${paths.provider.documentNew}?${search}` : paths.provider.documentNew;
  },
  uploadCard: (typeCode?: string) =>
    typeCode
      ? `${paths.technician.uploadCard}?type=${encodeURIComponent(typeCode)}`
      : paths.technician.uploadCard,
};

/** Sign-in URL that brings the user back to `redirectTo` afterwards. */
export const signInHref = (redirectTo?: string): string =>
  redirectTo && redirectTo !== paths.home
    ? `${paths.auth.signIn}?redirectTo=${encodeURIComponent(redirectTo)}`
    : paths.auth.signIn;

/** Only same-origin paths are followed after sign-in, so the parameter cannot send a user elsewhere. */
export const safeRedirectTarget = (value: string | null): string | null =>
  value && value.startsWith("/") && !value.startsWith("//") && !value.startsWith("/\\") ? value : null;
