import type { LocationQueryValue, RouteLocationRaw } from 'vue-router';

/** Where to go after signing in: the page asked for, if it is one of ours, else the buildings list. */
export function redirectTarget(value: LocationQueryValue | LocationQueryValue[] | undefined): RouteLocationRaw {
  const path = Array.isArray(value) ? value[0] : value;
  // Only same-site paths: "//host" or "/\host" would leave the app.
  if (typeof path === 'string' && path.startsWith('/') && !path.startsWith('//') && !path.startsWith('/\\'))
    return path;
  return { name: 'buildings' };
}
