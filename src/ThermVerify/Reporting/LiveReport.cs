using System.Globalization;
using ThermVerify.Files;

namespace ThermVerify.Reporting;

/// <summary>
/// A report folder that an open browser page keeps current: report.html carries a stamp and a small script that loads
/// live.js every second (a script from the page's own folder loads from a file: URL, where fetching would be refused);
/// live.js names the newest stamp, and a page whose stamp is older reloads itself. The HTML is written before live.js,
/// so a reload always finds the newer page.
/// </summary>
public static class LiveReport
{
    public const string StampFile = "live.js";

    public static IReadOnlyList<string> Write(CheckReport report, string directory, long stamp)
    {
        var text = stamp.ToString(CultureInfo.InvariantCulture);
        var files = ReportDirectory.Write(report, directory, overwrite: true, html => html.Replace("</body>", Script(text) + "</body>", StringComparison.Ordinal));
        var live = Path.Combine(directory, StampFile);
        AtomicFile.WriteAllText(live, $"thermverifyLive(\"{text}\");\n", overwrite: true);
        return [.. files, Path.GetFullPath(live)];
    }

    private static string Script(string stamp) => $$"""
        <script>
        (function () {
          var stamp = "{{stamp}}";
          window.thermverifyLive = function (now) { if (now !== stamp) location.reload(); };
          setInterval(function () {
            var s = document.createElement("script");
            s.src = "{{StampFile}}?" + Date.now();
            s.onload = s.onerror = function () { s.remove(); };
            document.head.appendChild(s);
          }, 1000);
        })();
        </script>

        """;
}
