// Ctrl+Enter (⌘+Enter) sends a form from any of its fields: the shop's long forms say so under their title.
export function submitOnCtrlEnter(submit: () => unknown) {
  return (event: React.KeyboardEvent) => {
    if (event.key === 'Enter' && (event.ctrlKey || event.metaKey)) {
      event.preventDefault();
      void submit();
    }
  };
}
