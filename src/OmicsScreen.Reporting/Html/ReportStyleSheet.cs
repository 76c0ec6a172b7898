namespace OmicsScreen.Reporting.Html;

/// <summary>
/// The one style sheet of the report, inlined in its head: readable on screen, and at A4 in print
/// with figures, caution boxes and table rows never split across pages.
/// </summary>
/// <remarks>
/// The text holds no '&lt;' or '&amp;', so it is valid as XML element content and the report stays
/// parseable as XHTML. Fonts are the reader's own (no web font: the report makes no network request).
/// The caution colour is vermillion from the Okabe &amp; Ito (2008) colour-blind-safe palette.
/// </remarks>
internal static class ReportStyleSheet
{
    public const string Css = """
        :root { color-scheme: light; }
        html { -webkit-text-size-adjust: 100%; }
        body { margin: 0; background: #ffffff; color: #1b1b1b; line-height: 1.45;
          font-family: system-ui, -apple-system, "Segoe UI", Roboto, "DejaVu Sans", "Liberation Sans", Arial, sans-serif; }
        main { max-width: 62rem; margin: 0 auto; padding: 1.5rem 1.25rem 3rem; }
        h1 { font-size: 1.75rem; margin: 0 0 0.75rem; }
        h2 { font-size: 1.35rem; margin: 2rem 0 0.6rem; padding-bottom: 0.2rem; border-bottom: 1px solid #c8c8c8; }
        h3 { font-size: 1.1rem; margin: 1.4rem 0 0.5rem; }
        h4, h5, h6 { font-size: 1rem; margin: 1.1rem 0 0.4rem; }
        p, ul { margin: 0.5rem 0; max-width: 48rem; }
        table { border-collapse: collapse; margin: 0.75rem 0 1.25rem; font-size: 0.9rem; max-width: 100%; }
        caption { caption-side: top; text-align: left; font-weight: 600; padding: 0 0 0.35rem; }
        th, td { padding: 0.25rem 0.65rem; border-bottom: 1px solid #dddddd; vertical-align: top; text-align: left; overflow-wrap: break-word; }
        thead th { background: #f0f0f0; border-bottom: 2px solid #9a9a9a; }
        tbody th { font-weight: 600; }
        .num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
        .unbroken { overflow-wrap: anywhere; word-break: break-all; }
        dl { display: grid; grid-template-columns: max-content 1fr; gap: 0.25rem 1.25rem; margin: 0.75rem 0; }
        dt { font-weight: 600; }
        .legend { font-size: 0.85rem; color: #333333; }
        nav.contents { margin: 1rem 0 1.5rem; padding: 0.5rem 1rem; border: 1px solid #dddddd; background: #fafafa; max-width: 48rem; }
        nav.contents ol { margin: 0.25rem 0; padding-left: 1.5rem; columns: 2; column-gap: 2rem; }
        .contents-title { font-weight: 600; margin: 0; }
        a { color: #0b5394; }
        dd { margin: 0; overflow-wrap: anywhere; }
        .caution { margin: 1rem 0; padding: 0.6rem 1rem; border-left: 0.4rem solid #D55E00; background: #fbf1ea; }
        .caution h2, .caution h3, .caution h4, .caution h5, .caution h6 { margin: 0.2rem 0 0.4rem; border: 0; font-size: 1rem; }
        figure { margin: 1rem 0 1.5rem; }
        figure svg { display: block; max-width: 100%; height: auto; }
        figcaption { margin-top: 0.35rem; font-size: 0.9rem; color: #333333; max-width: 48rem; }
        @page { size: A4; margin: 15mm; }
        @media print {
          body { font-size: 10pt; }
          main { max-width: none; padding: 0; }
          figure, .caution, tr, dl { break-inside: avoid; page-break-inside: avoid; }
          h1, h2, h3, h4 { break-after: avoid; page-break-after: avoid; }
          thead { display: table-header-group; }
          caption, thead, tr:first-child { break-after: avoid; page-break-after: avoid; }
          table { font-size: 9pt; }
          th, td { padding: 0.2rem 0.4rem; }
          nav.contents a { color: inherit; text-decoration: none; }
        }
        """;
}
