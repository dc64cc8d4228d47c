import QRCode from 'qrcode';

/**
 * A QR code for a text (an address) as an SVG data URL: vector, so it prints sharp at any
 * size, and an <img> with its own alt text. Error correction M survives a scuffed label.
 */
export async function qrDataUrl(text: string): Promise<string> {
  const svg = await QRCode.toString(text, { type: 'svg', errorCorrectionLevel: 'M', margin: 1, color: { dark: '#000000', light: '#ffffff' } });
  return `data:image/svg+xml;charset=utf-8,${encodeURIComponent(svg)}`;
}
