export { AccessDenied } from './AccessDenied';
export { Alert, type AlertTone } from './Alert';
export { Button, LinkButton, buttonClasses, type ButtonProps, type ButtonVariant } from './Button';
export { Card } from './Card';
export { CopyButton } from './CopyButton';
export {
  DataTable,
  createDataTableColumnHelper,
  dataTableFeatures,
  type DataTableColumn,
  type DataTableFeatures,
} from './DataTable';
export { FictionalDataLabel } from './FictionalDataLabel';
export { Field, Input, Select, Switch, Textarea } from './Field';
export { LoadingState } from './LoadingState';
export { PageHeader } from './PageHeader';
export { Stat, StatGroup } from './Stat';
