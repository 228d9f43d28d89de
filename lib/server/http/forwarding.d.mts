export function dropUntrustedForwarding<H extends Record<string, string | string[] | undefined>>(headers: H, trustProxy: boolean): H;
