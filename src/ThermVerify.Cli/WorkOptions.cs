using System.CommandLine;
using ThermVerify.Api;
using ThermVerify.Limits;

namespace ThermVerify.Cli;

/// <summary>
/// The options every command shares on the work it may do: a time limit and the bounds on points, conversions and
/// file sizes (docs/design-file.md, "Bounds on the work"). <see cref="Run"/> runs a command's body under them, with
/// Ctrl+C and the time limit as one cancellation every analysis observes.
/// </summary>
internal sealed class WorkOptions
{
    private readonly Option<double?> timeout = new("--timeout") { Description = "stop with exit code 3 when the work takes longer than this many seconds" };
    private readonly Option<int> maxPoints = new("--max-points")
    {
        Description = "largest number of temperatures a sweep may have",
        DefaultValueFactory = _ => WorkLimits.Default.MaximumSweepPoints,
    };
    private readonly Option<int> maxConversions = new("--max-conversions")
    {
        Description = "conversions one sampling run may simulate before it counts as unsettled",
        DefaultValueFactory = _ => WorkLimits.Default.MaximumConversions,
    };
    private readonly Option<bool> progressLines = new("--progress")
    {
        Description = "show progress on standard error even when it is not a terminal: a plain line every tenth of the run (for CI logs)",
    };
    private readonly Option<long> maxFileSize = new("--max-file-size")
    {
        Description = "largest design, table or subcircuit file read, in bytes",
        DefaultValueFactory = _ => WorkLimits.Default.MaximumFileBytes,
    };

    public static WorkOptions AddTo(Command command)
    {
        var work = new WorkOptions();
        command.Options.Add(work.timeout);
        command.Options.Add(work.maxPoints);
        command.Options.Add(work.maxConversions);
        command.Options.Add(work.maxFileSize);
        command.Options.Add(work.progressLines);
        work.timeout.Validators.Add(r =>
        {
            if (r.GetValueOrDefault<double?>() is { } s && !(s > 0 && s <= 1e7)) r.AddError("--timeout is a number of seconds, more than 0");
        });
        work.maxPoints.Validators.Add(r =>
        {
            if (r.GetValueOrDefault<int>() < 2) r.AddError("--max-points must be at least 2");
        });
        work.maxConversions.Validators.Add(r =>
        {
            if (r.GetValueOrDefault<int>() < 1) r.AddError("--max-conversions must be at least 1");
        });
        work.maxFileSize.Validators.Add(r =>
        {
            if (r.GetValueOrDefault<long>() < 1024) r.AddError("--max-file-size must be at least 1024 bytes");
        });
        return work;
    }

    public WorkLimits Limits(ParseResult parsed) => new()
    {
        MaximumSweepPoints = parsed.GetValue(maxPoints),
        MaximumConversions = parsed.GetValue(maxConversions),
        MaximumFileBytes = parsed.GetValue(maxFileSize),
    };

    /// <summary>The progress display of a long run of <paramref name="what"/>, or none (see <see cref="ProgressDisplay.For"/>).</summary>
    public ProgressDisplay? Progress(ParseResult parsed, string what, bool quiet = false) =>
        ProgressDisplay.For(parsed.InvocationConfiguration.Error, what, quiet, parsed.GetValue(progressLines));

    /// <summary>
    /// Runs <paramref name="body"/> with the limits and one token that Ctrl+C (<see cref="Interruption"/>) and the time limit both cancel; a stop
    /// by the time limit becomes <see cref="TimeLimitException"/> (exit code 3), a stop by Ctrl+C stays a cancellation (130).
    /// </summary>
    public Task<int> Run(ParseResult parsed, CancellationToken interrupt, Func<CancellationToken, int> body)
    {
        var seconds = parsed.GetValue(timeout);
        using var interrupted = CancellationTokenSource.CreateLinkedTokenSource(interrupt, Interruption.Token);
        interrupt = interrupted.Token;
        using var limit = new CancellationTokenSource();
        if (seconds is { } s) limit.CancelAfter(TimeSpan.FromSeconds(s));
        using var either = CancellationTokenSource.CreateLinkedTokenSource(interrupt, limit.Token);
        using var scope = Work.Scope(either.Token, Limits(parsed));
        try
        {
            return Task.FromResult(body(either.Token));
        }
        catch (Exception e) when (seconds is { } limitSeconds && limit.IsCancellationRequested && !interrupt.IsCancellationRequested
                                  && Failure.KindOf(e) == FailureKind.Cancelled)
        {
            throw new TimeLimitException(TimeSpan.FromSeconds(limitSeconds), e);
        }
    }
}
