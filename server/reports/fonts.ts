import { dirname, join } from 'node:path';

/**
 * Open Sans as TrueType (pdfkit cannot read WOFF2, and each WOFF subset of the web package covers one
 * Unicode range). The regular and semibold files are embedded, subset, in every report.
 * The file paths are the font names: pdfkit caches a font under the name it was first opened with,
 * and the regular face is the document's default font, opened by path.
 */
const root = dirname(require.resolve('@expo-google-fonts/open-sans/package.json'));

export const REGULAR = join(root, '400Regular', 'OpenSans_400Regular.ttf');
export const SEMIBOLD = join(root, '600SemiBold', 'OpenSans_600SemiBold.ttf');
