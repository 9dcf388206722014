import './TabBar.css';

interface TabBarProps<T extends string> {
  label: string;
  value: T;
  tabs: readonly { value: T; label: string }[];
  onChange(value: T): void;
}

/** Tabs of one screen (not routes): big, always visible, the current one marked by shape and weight. */
export function TabBar<T extends string>({ label, value, tabs, onChange }: TabBarProps<T>) {
  return (
    <div className="tab-bar" role="tablist" aria-label={label}>
      {tabs.map((tab) => (
        <button
          key={tab.value}
          type="button"
          role="tab"
          aria-selected={tab.value === value}
          className={`tab-bar__tab ${tab.value === value ? 'tab-bar__tab--current' : ''}`}
          onClick={() => onChange(tab.value)}
          data-testid={`tab-${tab.value}`}
        >
          {tab.label}
        </button>
      ))}
    </div>
  );
}
