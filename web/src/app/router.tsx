import type { Me } from '@crumbproof/shared';
import type { ComponentType } from 'react';
import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { SignInRoute } from '@/features/auth/routes/sign-in';
import { PublicShell, ShellFrame } from './layout/app-shell';
import { RoleGate } from './layout/role-gate';
import { firstPathFor, PAGES, type PageKey } from './navigation';
import { HomeRedirect } from './routes/home-redirect';
import { PageLoading } from './routes/page-loading';
import { NotFoundRoute } from './routes/not-found';
import { RouteError } from './routes/route-error';

/**
 * Each page's code loads when its route is first visited (React Router's lazy routes), so the
 * sign-in page and the counter never download the editors or the label renderer. The page gate
 * wraps the loaded page, as it would an eager one.
 */
function loaded(load: () => Promise<ComponentType>): Pick<RouteObject, 'lazy'> {
  return {
    lazy: async () => {
      const Page = await load();
      return { element: <Page /> };
    },
  };
}

function gated(page: PageKey, load: () => Promise<ComponentType>): Pick<RouteObject, 'lazy'> {
  return {
    lazy: async () => {
      const Page = await load();
      return {
        element: (
          <RoleGate page={page}>
            <Page />
          </RoleGate>
        ),
      };
    },
  };
}

const PAGE_ROUTES: Record<PageKey, Pick<RouteObject, 'lazy'>> = {
  ingredients: gated('ingredients', () => import('@/features/ingredients/routes/ingredients').then((m) => m.IngredientsRoute)),
  today: gated('today', () => import('@/features/today/routes/today').then((m) => m.TodayRoute)),
  recipes: gated('recipes', () => import('@/features/recipes/routes/recipes').then((m) => m.RecipesRoute)),
  counter: gated('counter', () => import('@/features/counter/routes/counter').then((m) => m.CounterRoute)),
  labels: gated('labels', () => import('@/features/labels/routes/labels').then((m) => m.LabelsRoute)),
  approvals: gated('approvals', () => import('@/features/approvals/routes/approvals').then((m) => m.ApprovalsRoute)),
  audit: gated('audit', () => import('@/features/audit/routes/audit').then((m) => m.AuditRoute)),
  kitchen: gated('kitchen', () => import('@/features/kitchen/routes/kitchen').then((m) => m.KitchenRoute)),
  users: gated('users', () => import('@/features/users/routes/users').then((m) => m.UsersRoute)),
  mail: gated('mail', () => import('@/features/mail/routes/mail').then((m) => m.MailRoute)),
};

/** Someone of several kitchens who has not named one yet lands on "/": it opens their first page at the kitchen they work in. */
const homeFor = (me: Me) => (me.kitchen === null && me.kitchens.length > 1 ? '/' : firstPathFor(me.role));

/** Every route of the web app, in one place. */
export const routes: RouteObject[] = [
  {
    errorElement: (
      <ShellFrame>
        <RouteError />
      </ShellFrame>
    ),
    // Shown while the first page's code arrives.
    hydrateFallbackElement: <PageLoading />,
    children: [
      {
        element: <PublicShell />,
        children: [
          { path: '/sign-in', element: <SignInRoute homeFor={homeFor} /> },
          { path: '/first-manager', ...loaded(() => import('@/features/auth/routes/first-manager').then((m) => m.FirstManagerRoute)) },
          { path: '/set-password', ...loaded(() => import('@/features/auth/routes/set-password').then((m) => m.SetPasswordRoute)) },
          {
            path: '/forgot-password',
            ...loaded(() => import('@/features/auth/routes/forgot-password').then((m) => m.ForgotPasswordRoute)),
          },
        ],
      },
      {
        path: '/',
        ...loaded(() => import('./layout/signed-in-shell').then((m) => m.SignedInShell)),
        children: [
          {
            // Errors inside a page keep the header and navigation around them.
            errorElement: <RouteError />,
            children: [
              { index: true, element: <HomeRedirect /> },
              ...(Object.keys(PAGES) as PageKey[]).map((key) => ({ path: PAGES[key].path.slice(1), ...PAGE_ROUTES[key] })),
              // The counter's other views (questions, on sale) at their own addresses.
              { path: 'counter/:view', ...PAGE_ROUTES.counter },
              // Inside Recipes: the page gate first; the editor and swap check refuse front of house themselves.
              {
                path: 'recipes/new',
                ...gated('recipes', () => import('@/features/recipes/routes/recipe-editor').then((m) => m.NewRecipeRoute)),
              },
              {
                path: 'recipes/swap',
                ...gated('recipes', () => import('@/features/swaps/routes/swap-check').then((m) => m.SwapCheckRoute)),
              },
              { path: 'recipes/:code', ...gated('recipes', () => import('@/features/recipes/routes/recipe').then((m) => m.RecipeRoute)) },
              {
                path: 'recipes/:code/edit',
                ...gated('recipes', () => import('@/features/recipes/routes/recipe-editor').then((m) => m.RecipeEditorRoute)),
              },
              {
                path: 'ingredients/new',
                ...gated('ingredients', () => import('@/features/ingredients/routes/ingredient').then((m) => m.NewIngredientRoute)),
              },
              {
                path: 'ingredients/import',
                ...gated('ingredients', () =>
                  import('@/features/ingredients/routes/import-ingredients').then((m) => m.ImportIngredientsRoute),
                ),
              },
              {
                path: 'ingredients/:code',
                ...gated('ingredients', () => import('@/features/ingredients/routes/ingredient').then((m) => m.IngredientRoute)),
              },
              { path: '*', element: <NotFoundRoute /> },
            ],
          },
        ],
      },
    ],
  },
];

export function createAppRouter() {
  return createBrowserRouter(routes);
}
