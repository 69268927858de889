namespace Lookup.Sweeps;

/// <summary>The fixed parts of the HTML report: policy, style and the few lines of script that filter by kind.</summary>
internal static class SweepHtmlPage
{
    /// <summary>Forbids every fetch: images only from data: URIs, style and script only inline.</summary>
    public const string ContentSecurityPolicy =
        "default-src 'none'; img-src data:; style-src 'unsafe-inline'; script-src 'unsafe-inline'";

    public const string Style = """
        body{font:14px/1.4 system-ui,sans-serif;margin:1.5em;color:#222;background:#fff}
        h1{font-size:1.4em}h2{font-size:1.1em;margin:0 0 .3em}
        .notice{border-left:4px solid #b00;padding:.4em .8em;background:#fff4f4}
        .summary td,.summary th,.pairs td,.pairs th{padding:.15em .6em;text-align:left}
        .filters label{margin-right:1em}
        section.finding{border:1px solid #ccc;border-radius:6px;padding:.8em;margin:1em 0}
        .photos{display:flex;flex-wrap:wrap;gap:.8em}
        figure{margin:0;width:180px}
        figure img,.nopreview{width:180px;height:180px;object-fit:contain;background:#f3f3f3;border:1px solid #ddd}
        .nopreview{display:flex;align-items:center;justify-content:center;color:#888}
        figcaption{font-size:12px;word-break:break-all}
        .role{color:#b00}.muted{color:#777}.caption{color:#444}
        details.bands{margin:1em 0}details.bands summary{cursor:pointer;font-weight:600}
        figure.calibration{width:auto;max-width:100%;margin:.6em 0}
        figure.calibration img{width:100%;max-width:960px;height:auto;background:#fff}
        figure.calibration figcaption{font-size:13px;word-break:normal;max-width:960px}
        .uncalibrated{border-left:4px solid #c90;padding:.4em .8em;background:#fffbea}
        .new{font-size:.75em;background:#b00;color:#fff;border-radius:3px;padding:0 .4em;vertical-align:middle}
        """;

    /// <summary>Shows or hides the findings of a kind when its box is ticked or cleared.</summary>
    public const string Script = """
        document.querySelectorAll('input[data-kind]').forEach(function (box) {
          box.addEventListener('change', function () {
            document.querySelectorAll('section[data-kind="' + box.dataset.kind + '"]').forEach(function (s) { s.hidden = !box.checked; });
          });
        });
        """;
}
