import type { Me } from '@crumbproof/shared';
import type { ReactNode } from 'react';
import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { SignInRoute } from '@/features/auth/routes/sign-in';
import { FirstManagerRoute } from '@/features/auth/routes/first-manager';
import { ForgotPasswordRoute } from '@/features/auth/routes/forgot-password';
import { SetPasswordRoute } from '@/features/auth/routes/set-password';
import { MailRoute } from '@/features/mail/routes/mail';
import { ApprovalsRoute } from '@/features/approvals/routes/approvals';
import { AuditRoute } from '@/features/audit/routes/audit';
import { CounterRoute } from '@/features/counter/routes/counter';
import { IngredientsRoute } from '@/features/ingredients/routes/ingredients';
import { ImportIngredientsRoute } from '@/features/ingredients/routes/import-ingredients';
import { IngredientRoute, NewIngredientRoute } from '@/features/ingredients/routes/ingredient';
import { LabelsRoute } from '@/features/labels/routes/labels';
import { RecipeRoute } from '@/features/recipes/routes/recipe';
import { NewRecipeRoute, RecipeEditorRoute } from '@/features/recipes/routes/recipe-editor';
import { RecipesRoute } from '@/features/recipes/routes/recipes';
import { SwapCheckRoute } from '@/features/swaps/routes/swap-check';
import { KitchenRoute } from '@/features/kitchen/routes/kitchen';
import { UsersRoute } from '@/features/users/routes/users';
import { AppShell, PublicShell, ShellFrame } from './layout/app-shell';
import { RequireSignIn } from './layout/require-sign-in';
import { RoleGate } from './layout/role-gate';
import { firstPathFor, PAGES, type PageKey } from './navigation';
import { HomeRedirect } from './routes/home-redirect';
import { NotFoundRoute } from './routes/not-found';
import { RouteError } from './routes/route-error';

const PAGE_ELEMENTS: Record<PageKey, ReactNode> = {
  ingredients: <IngredientsRoute />,
  recipes: <RecipesRoute />,
  counter: <CounterRoute />,
  labels: <LabelsRoute />,
  approvals: <ApprovalsRoute />,
  audit: <AuditRoute />,
  kitchen: <KitchenRoute />,
  users: <UsersRoute />,
  mail: <MailRoute />,
};

const homeFor = (me: Me) => firstPathFor(me.role);

/** Every route of the web app, in one place. */
export const routes: RouteObject[] = [
  {
    errorElement: (
      <ShellFrame>
        <RouteError />
      </ShellFrame>
    ),
    children: [
      {
        element: <PublicShell />,
        children: [
          { path: '/sign-in', element: <SignInRoute homeFor={homeFor} /> },
          { path: '/first-manager', element: <FirstManagerRoute /> },
          { path: '/set-password', element: <SetPasswordRoute /> },
          { path: '/forgot-password', element: <ForgotPasswordRoute /> },
        ],
      },
      {
        path: '/',
        element: (
          <RequireSignIn>
            <AppShell />
          </RequireSignIn>
        ),
        children: [
          {
            // Errors inside a page keep the header and navigation around them.
            errorElement: <RouteError />,
            children: [
              { index: true, element: <HomeRedirect /> },
              ...(Object.keys(PAGES) as PageKey[]).map((key) => ({
                path: PAGES[key].path.slice(1),
                element: <RoleGate page={key}>{PAGE_ELEMENTS[key]}</RoleGate>,
              })),
              // The counter's other views (questions, on sale) at their own addresses.
              {
                path: 'counter/:view',
                element: (
                  <RoleGate page="counter">
                    <CounterRoute />
                  </RoleGate>
                ),
              },
              // Inside Recipes: the page gate first; the editor and swap check refuse front of house themselves.
              {
                path: 'recipes/new',
                element: (
                  <RoleGate page="recipes">
                    <NewRecipeRoute />
                  </RoleGate>
                ),
              },
              {
                path: 'recipes/swap',
                element: (
                  <RoleGate page="recipes">
                    <SwapCheckRoute />
                  </RoleGate>
                ),
              },
              {
                path: 'recipes/:code',
                element: (
                  <RoleGate page="recipes">
                    <RecipeRoute />
                  </RoleGate>
                ),
              },
              {
                path: 'recipes/:code/edit',
                element: (
                  <RoleGate page="recipes">
                    <RecipeEditorRoute />
                  </RoleGate>
                ),
              },
              {
                path: 'ingredients/new',
                element: (
                  <RoleGate page="ingredients">
                    <NewIngredientRoute />
                  </RoleGate>
                ),
              },
              {
                path: 'ingredients/import',
                element: (
                  <RoleGate page="ingredients">
                    <ImportIngredientsRoute />
                  </RoleGate>
                ),
              },
              {
                path: 'ingredients/:code',
                element: (
                  <RoleGate page="ingredients">
                    <IngredientRoute />
                  </RoleGate>
                ),
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
