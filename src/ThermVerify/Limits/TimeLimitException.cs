namespace ThermVerify.Limits;

/// <summary>The run reached its time limit (`--timeout`) before it finished; nothing was written.</summary>
public sealed class TimeLimitException(TimeSpan limit, Exception? inner = null)
    : Exception($"stopped at the time limit of {limit.TotalSeconds:0.###} s (--timeout) before the work was done; no output file was written or changed. " +
                "Raise --timeout, or ask for less work (a coarser [check] step, fewer units)", inner)
{
    public TimeSpan Limit { get; } = limit;
}
