// Inter from local files (no font CDN): regular, medium, semibold, bold; latin subset only (the product's text is
// English, and the other subsets' @font-face rules would still be shipped in the style sheet).
import '@fontsource/inter/latin-400.css';
import '@fontsource/inter/latin-500.css';
import '@fontsource/inter/latin-600.css';
import '@fontsource/inter/latin-700.css';
