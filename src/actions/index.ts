// Astro Actions for the plain HTML forms of the reading and bench side. Each renders its answer on the page
// that posted it, so a refused form comes back with what was typed and nothing travels through the address.
import { defineAction } from 'astro:actions';
import { submitBenchReportForm } from './bench-report';
import { submitReportFixForm } from './report-fix';
import { submitAccountForm } from './account';
import { submitAdminUserForm, submitWordFamilyForm } from './admin';
import { submitHandoverNoteForm, submitJobSheetForm, submitNewJobForm, submitWithdrawNoteForm } from './bench-work';
import { submitDecisionForm, submitFixFlagForm, submitReportResolutionForm } from './proofing';
import { submitAmendForm, submitDiscardForm, submitWithdrawForm } from './writing';
import { submitFollowForm, submitMarkReadForm, submitNotificationSettingsForm } from './following';

// No `input` schema: Astro 5's form reader unwraps schemas with zod 3 classes, and this project's zod 4
// schemas (resolved in the server bundle) make it throw. Each handler takes the FormData and checks it with
// the one shared zod 4 schema, answering refusals with what was typed.
export const server = {
  benchReport: defineAction({ accept: 'form', handler: submitBenchReportForm }),
  reportFix: defineAction({ accept: 'form', handler: submitReportFixForm }),
  account: defineAction({ accept: 'form', handler: submitAccountForm }),
  proofingDecision: defineAction({ accept: 'form', handler: submitDecisionForm }),
  fixFlag: defineAction({ accept: 'form', handler: submitFixFlagForm }),
  reportResolution: defineAction({ accept: 'form', handler: submitReportResolutionForm }),
  amend: defineAction({ accept: 'form', handler: submitAmendForm }),
  withdraw: defineAction({ accept: 'form', handler: submitWithdrawForm }),
  discardDraft: defineAction({ accept: 'form', handler: submitDiscardForm }),
  adminUser: defineAction({ accept: 'form', handler: submitAdminUserForm }),
  wordFamily: defineAction({ accept: 'form', handler: submitWordFamilyForm }),
  newJob: defineAction({ accept: 'form', handler: submitNewJobForm }),
  jobSheet: defineAction({ accept: 'form', handler: submitJobSheetForm }),
  handoverNote: defineAction({ accept: 'form', handler: submitHandoverNoteForm }),
  withdrawNote: defineAction({ accept: 'form', handler: submitWithdrawNoteForm }),
  follow: defineAction({ accept: 'form', handler: submitFollowForm }),
  markNotificationsRead: defineAction({ accept: 'form', handler: submitMarkReadForm }),
  notificationSettings: defineAction({ accept: 'form', handler: submitNotificationSettingsForm }),
};
