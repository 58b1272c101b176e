using System.Diagnostics;

namespace ThermVerify.Tests.Reporting;

/// <summary>Runs headless Chromium on a file from disk, with a throwaway profile and no network, and returns what it printed.</summary>
public static class HeadlessChromium
{
    public static (int Exit, string Output, string Log) Run(string action, string htmlPath)
    {
        var profile = ReportFixture.NewTempFolder();
        var start = new ProcessStartInfo(ChromiumFactAttribute.Path)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
        };
        foreach (var arg in new[]
                 {
                     "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking",
                     "--disable-component-update", "--disable-sync", $"--user-data-dir={profile}", "--enable-logging=stderr", "--v=0",
                     "--window-size=1200,2400", action, new Uri(htmlPath).AbsoluteUri,
                 })
            start.ArgumentList.Add(arg);
        using var process = Process.Start(start)!;
        var output = process.StandardOutput.ReadToEndAsync();
        var error = process.StandardError.ReadToEndAsync();
        if (!process.WaitForExit(120_000))
        {
            process.Kill(entireProcessTree: true);
            throw new TimeoutException("chromium did not finish within 120 s");
        }
        return (process.ExitCode, output.Result, error.Result);
    }
}
