// The revision sheet's print button, as a file of our own so the page policy allows no inline script.
document.querySelector('[data-print-sheet]')?.addEventListener('click', () => window.print());
