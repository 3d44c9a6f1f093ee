import { ROLES } from '@crumbproof/shared';
import { describe, expect, it } from 'vitest';
import { canOpen, describeRoles, firstPathFor, PAGES, pagesFor, rolesThatCanOpen } from './navigation';

describe('navigation map', () => {
  it('sends each role to its first page', () => {
    expect(firstPathFor('manager')).toBe('/ingredients');
    expect(firstPathFor('pastry-chef')).toBe('/ingredients');
    expect(firstPathFor('front-of-house')).toBe('/counter');
  });

  it('lets only managers open users, audit and mail', () => {
    for (const page of ['users', 'audit', 'mail'] as const) {
      expect(rolesThatCanOpen(page)).toEqual(['manager']);
    }
    expect(canOpen('front-of-house', 'ingredients')).toBe(false);
  });

  it('lets the pastry chef read approvals (the manager approves), and not front of house', () => {
    expect(rolesThatCanOpen('approvals')).toEqual(['manager', 'pastry-chef']);
  });

  it('gives every role at least one page, and every page a role', () => {
    for (const role of ROLES) expect(pagesFor(role).length).toBeGreaterThan(0);
    for (const page of Object.keys(PAGES) as (keyof typeof PAGES)[]) {
      expect(rolesThatCanOpen(page).length).toBeGreaterThan(0);
    }
  });

  it('names roles in a sentence', () => {
    expect(describeRoles(['manager'])).toBe('Manager');
    expect(describeRoles(['manager', 'pastry-chef'])).toBe('Manager and Pastry chef');
    expect(describeRoles([...ROLES])).toBe('Manager, Pastry chef and Front of house');
  });
});
