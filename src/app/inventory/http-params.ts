import { HttpParams } from '@angular/common/http';

/** Query parameters from an object, leaving out empty values so the server's defaults apply. */
export function toParams(query: object): HttpParams {
  let params = new HttpParams();
  for (const [key, value] of Object.entries(query)) {
    if (value === undefined || value === null || value === '') continue;
    params = params.set(key, String(value));
  }
  return params;
}
