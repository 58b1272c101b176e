namespace ThermVerify.Simulation.Switched;

/// <summary>
/// The models and maps of one circuit, each computed once: a <see cref="SegmentModel"/> per switch configuration, an
/// <see cref="IntervalMap"/> per (configuration, interval of the period), maps for partial intervals (arbitrary read
/// times), and a <see cref="PeriodMap"/> per pattern of configurations.
/// </summary>
internal sealed class SwitchedMaps(LinearAssembly assembly, StateCoordinates coordinates, PeriodicTimeline timeline)
{
    /// <summary>Partial-interval maps kept for arbitrary read times before the cache is emptied.</summary>
    private const int PartialCacheLimit = 256;

    private readonly Dictionary<int, SegmentModel> models = [];
    private readonly Dictionary<(int Mask, int Interval), IntervalMap> intervalMaps = [];
    private readonly Dictionary<(int Mask, double Seconds), IntervalMap> partialMaps = [];
    private readonly Dictionary<string, PeriodMap> periodMaps = [];

    /// <summary>Intervals must be checked (an op-amp's linear region), so periods are stepped one by one.</summary>
    public bool HasChecks => assembly.Monitors.Count > 0;

    public SegmentModel ModelOf(int mask)
    {
        if (!models.TryGetValue(mask, out var model))
        {
            var (g, b) = assembly.Assemble(mask);
            model = coordinates.Reduce(g, b, () => PeriodicTimeline.Describe(assembly.Switches, mask));
            if (assembly.Residuals.Count > 0)
                model = model.WithInjections([.. assembly.Residuals.Select(residual =>
                {
                    var response = coordinates.Reduce(g, assembly.UnitInjection(residual.Pole), () => PeriodicTimeline.Describe(assembly.Switches, mask));
                    return (response.U, response.Offsets.ToArray());
                })]);
            models[mask] = model;
        }
        return model;
    }

    public IntervalMap FullMap(int mask, int interval)
    {
        if (!intervalMaps.TryGetValue((mask, interval), out var map))
        {
            map = IntervalMap.Build(ModelOf(mask), timeline.Durations[interval], assembly);
            intervalMaps[(mask, interval)] = map;
        }
        return map;
    }

    public IntervalMap PartialMap(int mask, double seconds)
    {
        if (!partialMaps.TryGetValue((mask, seconds), out var map))
        {
            if (partialMaps.Count >= PartialCacheLimit)
                partialMaps.Clear();
            map = IntervalMap.Build(ModelOf(mask), seconds, assembly);
            partialMaps[(mask, seconds)] = map;
        }
        return map;
    }

    public PeriodMap PeriodMapOf(int[] pattern)
    {
        var key = string.Join(",", pattern);
        if (!periodMaps.TryGetValue(key, out var map))
        {
            map = new PeriodMap(pattern.Select((mask, i) => FullMap(mask, i)), coordinates.StateCount);
            periodMaps[key] = map;
        }
        return map;
    }
}
