/** On every page: Arcbench forecasts flights, it does not clear a range. */
export function SiteFooter() {
  return (
    <footer className="border-t border-line px-6 py-3 text-micro text-ink-faint">
      Planning aid only — follow your range-safety rules, local codes and licensed practice.
    </footer>
  );
}
