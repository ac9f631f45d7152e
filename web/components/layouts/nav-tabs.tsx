import { NavLink } from 'react-router-dom';
import { cx } from '../../lib/cx';

export interface NavItem {
  to: string;
  label: string;
}

/** A row of links to a place's screens; the current one is marked by weight, rule and aria-current. */
export function NavTabs({ items, label, className }: { items: NavItem[]; label: string; className?: string }) {
  return (
    <nav aria-label={label} className={className}>
      <ul className="flex flex-wrap gap-x-1">
        {items.map((item) => (
          <li key={item.to}>
            <NavLink
              to={item.to}
              className={({ isActive }) =>
                cx(
                  'inline-flex h-11 items-center border-b-[3px] px-3 text-base no-underline',
                  isActive
                    ? 'border-accent-700 font-semibold text-ink-900 hover:text-ink-900'
                    : 'border-transparent text-ink-700 hover:border-ply-300 hover:text-ink-900',
                )
              }
            >
              {item.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
