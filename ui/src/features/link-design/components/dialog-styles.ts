import { makeStyles, tokens } from '@fluentui/react-components';

/** The editor's dialogs: a wide surface for the change tables, each table scrolling on its own. */
export const useEditorDialogStyles = makeStyles({
  changes: { maxHeight: '260px', overflowY: 'auto' },
  dialogGrid: { display: 'grid', rowGap: tokens.spacingVerticalM },
  wideDialog: { maxWidth: '760px', width: 'calc(100vw - 48px)' },
});
