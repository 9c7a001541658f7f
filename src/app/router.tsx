import { createBrowserRouter, RouterProvider } from "react-router-dom";
import { paths } from "@/config/paths.ts";
import { requireRole, requireUser } from "./require-role.ts";
import { RootFallback } from "./root-fallback.tsx";
import { RouteError } from "./route-error.tsx";

// Every page is its own lazily loaded module; only the shell above is in the first chunk.
const roleArea = () => import("./routes/app/role-area.tsx");

export const router = createBrowserRouter([
  {
    id: "root",
    HydrateFallback: RootFallback,
    ErrorBoundary: RouteError,
    children: [
      { index: true, lazy: () => import("./routes/landing.tsx") },
      { path: paths.gateCheck, lazy: () => import("./routes/gate/check.tsx") },
      {
        lazy: () => import("./routes/auth/auth-layout.tsx"),
        children: [
          { path: paths.auth.signIn, lazy: () => import("./routes/auth/sign-in.tsx") },
          { path: paths.auth.signUp, lazy: () => import("./routes/auth/sign-up.tsx") },
          { path: paths.auth.forgotPassword, lazy: () => import("./routes/auth/forgot-password.tsx") },
          { path: paths.auth.setPassword, lazy: () => import("./routes/auth/set-password.tsx") },
          { path: paths.auth.brokerUpload, lazy: () => import("./routes/auth/broker-upload.tsx") },
        ],
      },
      {
        id: "signed-in",
        loader: requireUser,
        lazy: () => import("./routes/app/app-layout.tsx"),
        children: [
          { path: paths.account, lazy: () => import("./routes/app/account.tsx") },
          { path: paths.mailLinks.documents, lazy: () => import("./routes/app/mail-link-documents.tsx") },
          {
            path: paths.mailLinks.documentNew,
            lazy: () => import("./routes/app/mail-link-document-new.tsx"),
          },
          {
            loader: requireRole("provider_admin"),
            lazy: roleArea,
            children: [
              { path: paths.provider.dashboard, lazy: () => import("./routes/provider/dashboard.tsx") },
              { path: paths.provider.technicians, lazy: () => import("./routes/provider/technicians.tsx") },
              {
                path: paths.provider.technicianNew,
                lazy: () => import("./routes/provider/technician-new.tsx"),
              },
              {
                path: paths.provider.techniciansImport,
                lazy: () => import("./routes/provider/technicians-import.tsx"),
              },
              { path: paths.provider.technician, lazy: () => import("./routes/provider/technician.tsx") },
              {
                path: paths.provider.technicianEdit,
                lazy: () => import("./routes/provider/technician-edit.tsx"),
              },
              { path: paths.provider.documents, lazy: () => import("./routes/provider/documents.tsx") },
              { path: paths.provider.documentNew, lazy: () => import("./routes/provider/document-new.tsx") },
              {
                path: paths.provider.serviceRequests,
                lazy: () => import("./routes/provider/service-requests.tsx"),
              },
              {
                path: paths.provider.serviceRequest,
                lazy: () => import("./routes/provider/service-request.tsx"),
              },
              { path: paths.provider.gateChecks, lazy: () => import("./routes/provider/gate-checks.tsx") },
              { path: paths.provider.brokers, lazy: () => import("./routes/provider/brokers.tsx") },
            ],
          },
          {
            loader: requireRole("provider_admin", "technician"),
            lazy: roleArea,
            children: [
              {
                path: paths.provider.workOrders,
                lazy: () => import("./routes/work-orders/work-order-list.tsx"),
              },
            ],
          },
          {
            loader: requireRole("buyer", "provider_admin"),
            lazy: roleArea,
            children: [{ path: paths.company, lazy: () => import("./routes/company.tsx") }],
          },
          {
            loader: requireRole("buyer", "provider_admin", "technician"),
            lazy: roleArea,
            children: [{ path: paths.workOrder, lazy: () => import("./routes/work-orders/work-order.tsx") }],
          },
          {
            loader: requireRole("technician"),
            lazy: roleArea,
            children: [
              { path: paths.technician.standing, lazy: () => import("./routes/technician/standing.tsx") },
              {
                path: paths.technician.uploadCard,
                lazy: () => import("./routes/technician/upload-card.tsx"),
              },
              { path: paths.technician.badge, lazy: () => import("./routes/technician/badge.tsx") },
            ],
          },
          {
            loader: requireRole("reviewer"),
            lazy: roleArea,
            children: [
              { path: paths.reviewer.queue, lazy: () => import("./routes/reviewer/queue.tsx") },
              { path: paths.reviewer.review, lazy: () => import("./routes/reviewer/review.tsx") },
            ],
          },
          {
            loader: requireRole("buyer"),
            lazy: roleArea,
            children: [
              { path: paths.buyer.directory, lazy: () => import("./routes/buyer/directory.tsx") },
              { path: paths.buyer.roster, lazy: () => import("./routes/buyer/roster.tsx") },
              { path: paths.buyer.sites, lazy: () => import("./routes/buyer/sites.tsx") },
              { path: paths.buyer.gateSign, lazy: () => import("./routes/buyer/gate-sign.tsx") },
              {
                path: paths.buyer.requirementSets,
                lazy: () => import("./routes/buyer/requirement-sets.tsx"),
              },
              {
                path: paths.buyer.workOrders,
                lazy: () => import("./routes/work-orders/work-order-list.tsx"),
              },
              { path: paths.buyer.workOrderNew, lazy: () => import("./routes/buyer/raise-work-order.tsx") },
              { path: paths.buyer.technician, lazy: () => import("./routes/buyer/technician.tsx") },
              {
                path: paths.buyer.serviceRequests,
                lazy: () => import("./routes/buyer/service-requests.tsx"),
              },
              {
                path: paths.buyer.serviceRequestNew,
                lazy: () => import("./routes/buyer/service-request-new.tsx"),
              },
              { path: paths.buyer.serviceRequest, lazy: () => import("./routes/buyer/service-request.tsx") },
              { path: paths.buyer.machines, lazy: () => import("./routes/buyer/machines.tsx") },
              { path: paths.buyer.machine, lazy: () => import("./routes/buyer/machine.tsx") },
              { path: paths.buyer.machineCopy, lazy: () => import("./routes/buyer/machine-copy.tsx") },
              {
                path: paths.buyer.machineTransfer,
                lazy: () => import("./routes/buyer/machine-transfer.tsx"),
              },
              {
                path: paths.buyer.machineTransfers,
                lazy: () => import("./routes/buyer/machine-transfers.tsx"),
              },
              { path: paths.buyer.machinesImport, lazy: () => import("./routes/buyer/machines-import.tsx") },
              {
                path: paths.buyer.machineMaintenance,
                lazy: () => import("./routes/buyer/machine-maintenance.tsx"),
              },
              { path: paths.buyer.gateChecks, lazy: () => import("./routes/buyer/gate-checks.tsx") },
              {
                path: paths.buyer.certificateRequests,
                lazy: () => import("./routes/buyer/certificate-requests.tsx"),
              },
            ],
          },
          {
            loader: requireRole("admin"),
            lazy: roleArea,
            children: [
              { path: paths.admin.users, lazy: () => import("./routes/admin/users.tsx") },
              { path: paths.admin.catalog, lazy: () => import("./routes/admin/catalogue.tsx") },
              { path: paths.admin.outbox, lazy: () => import("./routes/admin/outbox.tsx") },
              { path: paths.admin.baseline, lazy: () => import("./routes/admin/baseline.tsx") },
              { path: paths.admin.jobRuns, lazy: () => import("./routes/admin/job-runs.tsx") },
              {
                path: paths.admin.reportedReviews,
                lazy: () => import("./routes/admin/reported-reviews.tsx"),
              },
              { path: paths.admin.followUp, lazy: () => import("./routes/admin/follow-up.tsx") },
              { path: paths.admin.companies, lazy: () => import("./routes/admin/companies.tsx") },
              {
                path: paths.admin.machineCatalog,
                lazy: () => import("./routes/admin/machine-catalog.tsx"),
              },
            ],
          },
        ],
      },
      { path: "*", lazy: () => import("./routes/not-found.tsx") },
    ],
  },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
