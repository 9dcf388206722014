/** Reads a JSON response body for assertions (tests check the shape themselves). */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function json(res: Response): Promise<any> {
  return res.json();
}
