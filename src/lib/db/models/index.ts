import 'server-only';
import type { Sequelize } from 'sequelize';
import { getSequelize } from '../connection';
import { AuditEntry } from './audit-entry';
import { PasswordToken, SignInAttempt, StaffSession, TOKEN_PURPOSES, type TokenPurpose } from './auth';
import { Cam } from './cam';
import {
  ATTACHMENT_CONTENT_TYPES,
  ATTACHMENT_ENTITY_TYPES,
  CatalogueAttachment,
  type AttachmentContentType,
  type AttachmentEntityType,
} from './catalogue-attachment';
import { Build, Customer, Interview } from './customer';
import { DynoGain } from './dyno-gain';
import { DynoRun } from './dyno-run';
import { Job, JobSignOff } from './job';
import { LaborOperation } from './labor-operation';
import { Lead } from './lead';
import { LeadNote } from './lead-note';
import { NeedRule, NeedRuleItem } from './need-rule';
import { Part } from './part';
import { Payment, Quote, QuoteLine } from './quote';
import { QuoteLink } from './quote-link';
import { ShopSettings } from './shop-settings';
import { Supplier } from './supplier';
import { User } from './user';

export {
  AuditEntry,
  Build,
  Cam,
  CatalogueAttachment,
  Customer,
  DynoGain,
  DynoRun,
  Interview,
  Job,
  JobSignOff,
  LaborOperation,
  Lead,
  LeadNote,
  NeedRule,
  NeedRuleItem,
  Part,
  PasswordToken,
  Payment,
  Quote,
  QuoteLine,
  QuoteLink,
  ShopSettings,
  SignInAttempt,
  StaffSession,
  Supplier,
  User,
};
export {
  ATTACHMENT_CONTENT_TYPES,
  ATTACHMENT_ENTITY_TYPES,
  TOKEN_PURPOSES,
  type AttachmentContentType,
  type AttachmentEntityType,
  type TokenPurpose,
};

// Every model the app uses, bound together. A model missing here fails its first query with
// "Model not initialized", so a new model file is added to this list in the same commit.
const MODELS = [
  User,
  ShopSettings,
  Supplier,
  Cam,
  Part,
  LaborOperation,
  NeedRule,
  NeedRuleItem,
  Customer,
  Build,
  Interview,
  Quote,
  QuoteLine,
  QuoteLink,
  Payment,
  Lead,
  LeadNote,
  DynoRun,
  DynoGain,
  Job,
  JobSignOff,
  AuditEntry,
  CatalogueAttachment,
  StaffSession,
  PasswordToken,
  SignInAttempt,
];

let boundTo: Sequelize | undefined;

function associate() {
  Cam.belongsTo(Supplier, { foreignKey: 'supplierId', as: 'supplier' });
  Part.belongsTo(Supplier, { foreignKey: 'supplierId', as: 'supplier' });
  NeedRule.hasMany(NeedRuleItem, { foreignKey: 'ruleId', as: 'items' });
  NeedRuleItem.belongsTo(NeedRule, { foreignKey: 'ruleId' });
  NeedRuleItem.belongsTo(Part, { foreignKey: 'partId', as: 'part' });
  NeedRuleItem.belongsTo(LaborOperation, { foreignKey: 'laborOperationId', as: 'laborOperation' });
  Customer.hasMany(Build, { foreignKey: 'customerId', as: 'builds' });
  Build.belongsTo(Customer, { foreignKey: 'customerId', as: 'customer' });
  Build.belongsTo(Cam, { foreignKey: 'baselineCamId', as: 'baselineCam' });
  Interview.belongsTo(Build, { foreignKey: 'buildId', as: 'build' });
  Interview.belongsTo(User, { foreignKey: 'staffUserId', as: 'staffUser' });
  Interview.belongsTo(Cam, { foreignKey: 'chosenCamId', as: 'chosenCam' });
  Quote.belongsTo(Customer, { foreignKey: 'customerId', as: 'customer' });
  Quote.belongsTo(Build, { foreignKey: 'buildId', as: 'build' });
  Quote.belongsTo(Cam, { foreignKey: 'camId', as: 'cam' });
  Quote.belongsTo(User, { foreignKey: 'createdByUserId', as: 'createdBy' });
  Quote.belongsTo(User, { foreignKey: 'discountApprovedByUserId', as: 'discountApprovedBy' });
  Quote.hasMany(QuoteLine, { foreignKey: 'quoteId', as: 'lines' });
  Quote.hasMany(Payment, { foreignKey: 'quoteId', as: 'payments' });
  QuoteLine.belongsTo(Quote, { foreignKey: 'quoteId' });
  Payment.belongsTo(Quote, { foreignKey: 'quoteId', as: 'quote' });
  Payment.belongsTo(User, { foreignKey: 'recordedByUserId', as: 'recordedBy' });
  Lead.belongsTo(Customer, { foreignKey: 'customerId', as: 'customer' });
  Lead.hasMany(LeadNote, { foreignKey: 'leadId', as: 'notes' });
  LeadNote.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  DynoRun.belongsTo(Build, { foreignKey: 'buildId', as: 'build' });
  DynoRun.belongsTo(Cam, { foreignKey: 'camId', as: 'cam' });
  DynoRun.belongsTo(Quote, { foreignKey: 'quoteId', as: 'quote' });
  DynoRun.belongsTo(User, { foreignKey: 'recordedByUserId', as: 'recordedBy' });
  DynoGain.belongsTo(Build, { foreignKey: 'buildId', as: 'build' });
  DynoGain.belongsTo(Cam, { foreignKey: 'camId', as: 'cam' });
  AuditEntry.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  Quote.hasOne(Job, { foreignKey: 'quoteId', as: 'job' });
  Job.belongsTo(Quote, { foreignKey: 'quoteId', as: 'quote' });
  Job.belongsTo(User, { foreignKey: 'technicianUserId', as: 'technician' });
  Job.hasMany(JobSignOff, { foreignKey: 'jobId', as: 'signOffs' });
  JobSignOff.belongsTo(User, { foreignKey: 'signedByUserId', as: 'signedBy' });
}

/**
 * The process's connection, with every model bound to it. Importing this module binds them (see the call
 * below), so query code uses `Cam.findAll()` directly; calling db() again only binds anew after
 * closeSequelize() made a fresh connection (the CLI tools and tests that reconnect).
 */
export function db(): Sequelize {
  const sequelize = getSequelize();
  if (boundTo !== sequelize) {
    for (const model of MODELS) model.initModel(sequelize);
    associate();
    boundTo = sequelize;
  }
  return sequelize;
}

// Bound on import, not on first use: each route Next bundles, each CLI tool and each test file reaches the
// models only through this module, so whichever imports it first, the models are ready before any query.
// Creating the connection object opens no socket; the pool connects on the first query.
db();
