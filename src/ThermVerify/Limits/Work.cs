namespace ThermVerify.Limits;

/// <summary>
/// The run's cancellation and limits, visible to every analysis it starts on every thread (an
/// <see cref="AsyncLocal{T}"/> flows into tasks and parallel loops): the engines' inner loops call
/// <see cref="ThrowIfCancelled"/>, so Ctrl+C and a time limit stop a DC sweep, a transient, an AC sweep or a remedy
/// search within one solver step, without a token threaded through every signature. Entry points open a
/// <see cref="Scope"/>; outside one, nothing is cancelled and the default limits hold.
/// </summary>
internal static class Work
{
    private sealed record State(CancellationToken Cancel, WorkLimits Limits);

    private static readonly AsyncLocal<State?> Current = new();

    public static CancellationToken Cancel => Current.Value?.Cancel ?? CancellationToken.None;

    public static WorkLimits Limits => Current.Value?.Limits ?? WorkLimits.Default;

    /// <summary>Stops the work when the run was cancelled (Ctrl+C, a time limit, the embedding program's token).</summary>
    public static void ThrowIfCancelled()
    {
        if (Current.Value is { } state) state.Cancel.ThrowIfCancellationRequested();
    }

    /// <summary>
    /// Runs what follows under <paramref name="cancel"/> as well as any scope already open, with
    /// <paramref name="limits"/> (or the enclosing scope's). Dispose to close it.
    /// </summary>
    public static IDisposable Scope(CancellationToken cancel, WorkLimits? limits = null)
    {
        var outer = Current.Value;
        CancellationTokenSource? linked = null;
        var token = cancel;
        if (outer is not null && outer.Cancel.CanBeCanceled)
        {
            if (cancel.CanBeCanceled && cancel != outer.Cancel)
            {
                linked = CancellationTokenSource.CreateLinkedTokenSource(outer.Cancel, cancel);
                token = linked.Token;
            }
            else
            {
                token = outer.Cancel;
            }
        }
        Current.Value = new State(token, limits ?? outer?.Limits ?? WorkLimits.Default);
        return new Closing(outer, linked);
    }

    private sealed class Closing(State? outer, CancellationTokenSource? linked) : IDisposable
    {
        public void Dispose()
        {
            Current.Value = outer;
            linked?.Dispose();
        }
    }
}
