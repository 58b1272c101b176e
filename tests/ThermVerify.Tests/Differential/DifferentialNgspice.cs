using ThermVerify.Ngspice;

namespace ThermVerify.Tests.Differential;

/// <summary>
/// ngspice for the differential runs: the shared library in a worker process (<see cref="NgspiceWorker"/>), so that a
/// deck ngspice cannot finish (some random circuits make it crawl at femtosecond steps for hours) costs
/// <see cref="TimeLimit"/> and a new worker, and is recorded as ngspice's failure rather than hanging the run.
/// </summary>
internal static class DifferentialNgspice
{
    /// <summary>Longer than any deck ngspice finishes in these runs (they take milliseconds to a few seconds).</summary>
    public static readonly TimeSpan TimeLimit = TimeSpan.FromSeconds(20);

    private static readonly Lock Gate = new();
    private static NgspiceWorker? _worker;

    public static NgspiceResult Run(string deck)
    {
        lock (Gate)
        {
            if (_worker is { Usable: false })
            {
                _worker.Dispose();
                _worker = null;
            }
            _worker ??= NgspiceWorker.Start();
            return _worker.Run(deck, TimeLimit);
        }
    }
}
