export { mailKeys } from './api/keys';
export { listMailMessages, mailMessagesQueryOptions, useMailMessages } from './api/list-mail-messages';
export { getMailMessage, mailMessageIdSchema, mailMessageQueryOptions, useMailMessage } from './api/get-mail-message';
export { MailboxTable } from './components/MailboxTable';
export { MailBody, MailMessageView } from './components/MailMessageView';
