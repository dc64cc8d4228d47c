// Applies a stored theme choice before the first paint so a dim room never flashes white.
// Without a stored choice the CSS follows prefers-color-scheme on its own. A file of its own
// (not inline) so the content security policy can forbid inline scripts.
try {
  var stored = localStorage.getItem('varden.theme');
  if (stored === 'light' || stored === 'dark') document.documentElement.dataset.theme = stored;
} catch (e) {}
