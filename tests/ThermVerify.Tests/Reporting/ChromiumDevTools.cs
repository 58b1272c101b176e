using System.Diagnostics;
using System.Net.WebSockets;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using System.Text.RegularExpressions;

namespace ThermVerify.Tests.Reporting;

/// <summary>
/// Headless Chromium driven over its DevTools protocol (a WebSocket, JSON messages): open a page, evaluate an
/// expression in it. Enough to watch a page reload itself; no test library needed.
/// </summary>
internal sealed partial class ChromiumDevTools : IAsyncDisposable
{
    /// <summary>Only a guard against a browser that hangs; nothing here measures time.</summary>
    private static readonly TimeSpan HangGuard = TimeSpan.FromMinutes(3);

    private readonly Process process;
    private readonly ClientWebSocket socket = new();
    private readonly string profile;
    private int nextId;
    private string? session;

    private ChromiumDevTools(Process process, string profile)
    {
        this.process = process;
        this.profile = profile;
    }

    public static async Task<ChromiumDevTools> StartAsync()
    {
        var profile = ReportFixture.NewTempFolder();
        var start = new ProcessStartInfo(ChromiumFactAttribute.Path) { RedirectStandardError = true, RedirectStandardOutput = true };
        foreach (var arg in new[]
                 {
                     "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking",
                     "--disable-component-update", "--disable-sync", $"--user-data-dir={profile}", "--remote-debugging-port=0",
                     "--allow-file-access-from-files", "about:blank",
                 })
            start.ArgumentList.Add(arg);
        var process = Process.Start(start)!;
        var tools = new ChromiumDevTools(process, profile);
        using var guard = new CancellationTokenSource(HangGuard);
        while (await process.StandardError.ReadLineAsync(guard.Token) is { } line)
        {
            var endpoint = Endpoint().Match(line);
            if (!endpoint.Success) continue;
            await tools.socket.ConnectAsync(new Uri(endpoint.Groups[1].Value), guard.Token);
            _ = process.StandardError.ReadToEndAsync(); // keep the pipe drained
            return tools;
        }
        throw new InvalidOperationException("chromium ended without announcing its DevTools endpoint");
    }

    public async Task OpenAsync(string path)
    {
        var target = await SendAsync("Target.createTarget", new JsonObject { ["url"] = new Uri(path).AbsoluteUri }, inSession: false);
        var attached = await SendAsync("Target.attachToTarget",
            new JsonObject { ["targetId"] = target["targetId"]!.GetValue<string>(), ["flatten"] = true }, inSession: false);
        session = attached["sessionId"]!.GetValue<string>();
    }

    /// <summary>The value of a JavaScript expression in the open page, as text (null while the page has none, e.g. mid-reload).</summary>
    public async Task<string?> EvaluateAsync(string expression)
    {
        var result = await SendAsync("Runtime.evaluate", new JsonObject { ["expression"] = expression, ["returnByValue"] = true }, inSession: true);
        return result["result"]?["value"]?.ToString();
    }

    /// <summary>Evaluates until the expression is true (or the hang guard trips).</summary>
    public async Task WaitUntilAsync(string expression)
    {
        using var guard = new CancellationTokenSource(HangGuard);
        while (await EvaluateAsync(expression) != "true")
            await Task.Delay(100, guard.Token);
    }

    private async Task<JsonNode> SendAsync(string method, JsonObject parameters, bool inSession)
    {
        var id = ++nextId;
        var message = new JsonObject { ["id"] = id, ["method"] = method, ["params"] = parameters };
        if (inSession) message["sessionId"] = session;
        using var guard = new CancellationTokenSource(HangGuard);
        await socket.SendAsync(Encoding.UTF8.GetBytes(message.ToJsonString()), WebSocketMessageType.Text, true, guard.Token);
        while (true)
        {
            var reply = JsonNode.Parse(await ReceiveAsync(guard.Token))!;
            if (reply["id"]?.GetValue<int>() != id) continue; // events and other replies
            if (reply["error"] is { } error) throw new InvalidOperationException($"{method}: {error.ToJsonString()}");
            return reply["result"]!;
        }
    }

    private async Task<string> ReceiveAsync(CancellationToken cancel)
    {
        var buffer = new byte[1 << 16];
        using var text = new MemoryStream();
        WebSocketReceiveResult part;
        do
        {
            part = await socket.ReceiveAsync(buffer, cancel);
            text.Write(buffer, 0, part.Count);
        } while (!part.EndOfMessage);
        return Encoding.UTF8.GetString(text.ToArray());
    }

    public async ValueTask DisposeAsync()
    {
        socket.Dispose();
        if (!process.HasExited) process.Kill(entireProcessTree: true);
        await process.WaitForExitAsync();
        process.Dispose();
        try { Directory.Delete(profile, recursive: true); } catch (IOException) { } // the browser may still hold a file for a moment
    }

    [GeneratedRegex(@"DevTools listening on (ws://\S+)")]
    private static partial Regex Endpoint();
}
