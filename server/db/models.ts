// Every model class, for code in one domain that reads another domain's rows. Models are leaves (they import only
// sequelize and shared types), so reaching them here can never close an import circle the way a domain's index.ts,
// which also exports its routes, could. A domain's own files keep importing "./model.ts".
export { User, OneTimeToken } from "../accounts/model.ts";
export { AuditEvent } from "../audit/model.ts";
export { Company } from "../companies/model.ts";
export { CredentialType, Document, Credential } from "../credentials/model.ts";
export { BrokerContact, BrokerUploadRequest, BrokerRequestReminder } from "../credentials/broker-model.ts";
export { OutboxMessage, CaughtMail } from "../mail/model.ts";
export { Notification } from "../notices/model.ts";
export { JobReview } from "../reviews/model.ts";
export { Site, Equipment } from "../sites/model.ts";
export { RequirementSet, PlatformBaseline, JobRun } from "../standing/model.ts";
export { Technician } from "../technicians/model.ts";
export { WorkOrder, WorkOrderMessage } from "../work-orders/model.ts";
