// Scripts are server code, but the app's server modules start with `import 'server-only'`, which
// throws unless resolved the way a React server build resolves it. Import this module first and
// the app's modules after it with `await import(…)`: static imports resolve before this runs.
import { register } from 'node:module';

register(
  'data:text/javascript,' +
    encodeURIComponent(
      `export async function resolve(specifier, context, next) {
        if (specifier === 'server-only') return next(specifier, { ...context, conditions: [...context.conditions, 'react-server'] });
        return next(specifier, context);
      }`,
    ),
);
