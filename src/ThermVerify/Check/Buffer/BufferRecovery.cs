using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Simulation;
using ThermVerify.Quantities;

namespace ThermVerify.Check.Buffer;

/// <summary>The buffer's share of the settling error after the sampling kicks, and what the design would need.</summary>
public sealed record RecoveryResult(
    double Celsius,
    double? PrechargeVolts,
    double SettlingErrorVolts,
    double NoSlewLimitSettlingErrorVolts,
    double IdealBufferSettlingErrorVolts,
    double AllowedVolts,
    double? NeededGainBandwidthHertz,
    double? NeededSlewRateVoltsPerSecond,
    string Method)
{
    /// <summary>Where the gain-bandwidth search starts: a need equal to it means "this or less".</summary>
    public double? GainBandwidthFloorHertz { get; init; }

    /// <summary>What the real op-amp adds to the settling error beyond an ideal (fast, unlimited-slew) one.</summary>
    public double BufferShareVolts => SettlingErrorVolts - IdealBufferSettlingErrorVolts;

    /// <summary>The part the slew-rate limit adds: design op-amp against the same without a slew limit.</summary>
    public double SlewShareVolts => SettlingErrorVolts - NoSlewLimitSettlingErrorVolts;

    /// <summary>The part the finite gain-bandwidth adds: no slew limit at the design's GBW against 100× that GBW.</summary>
    public double BandwidthShareVolts => NoSlewLimitSettlingErrorVolts - IdealBufferSettlingErrorVolts;
}

/// <summary>
/// Recovery after each sampling kick, by simulation at the temperature and precharge case where `check` found the
/// largest settling error: the sampling transient (conversion after conversion until stable) with the design's
/// op-amp, and again with an ideal one (100 × the gain-bandwidth, no slew limit); the difference is the buffer's
/// share. The gain-bandwidth the design needs is the smallest that brings the settling error within ½ LSB with no
/// slew limit; the slew rate it needs is the smallest that does so at the larger of that and the design's
/// gain-bandwidth (both by bisection on the simulated sample). Neither exists when an ideal buffer still misses
/// ½ LSB: then the filter and the sampling network, not the op-amp, limit. The share is split into the slew-rate part
/// (the same op-amp without a slew limit) and the bandwidth part (that against the ideal one).
/// </summary>
internal static class BufferRecovery
{
    private const double IdealFactor = 100;

    /// <summary>The searches start here (relative to the design's GBW, and absolute for the slew rate); a result at the floor means any op-amp down to it will do.</summary>
    public const double GainBandwidthFloorFactor = 1e-4;
    public const double SlewRateFloorVoltsPerSecond = 1e3;
    private const double SearchPrecision = 0.02;

    /// <summary>1000 V/µs: faster than any op-amp a sensor front end would use, so a need above it is reported as none found.</summary>
    public const double SlewRateCeilingVoltsPerSecond = 1e9;

    public static RecoveryResult Run(FrontEndDesign design, double celsius, double? prechargeVolts, bool search, ICheckEngine? engine = null)
    {
        var b = BufferCircuits.Require(design);
        var adc = new ClosedFormModel(design).Adc;
        var allowed = adc.LsbVolts / 2;
        var settle = design.Check.SettleLimitLsb * adc.LsbVolts;
        double Error(BufferSpec spec) => SettlingError.Volts(design with { Buffer = spec }, celsius, prechargeVolts, settle, engine);
        // Far below the need the op-amp stays slewing and the transient may not converge: that candidate does not settle either.
        bool Settles(BufferSpec spec)
        {
            try
            {
                return Error(spec) <= allowed;
            }
            catch (Simulation.SimulationException)
            {
                return false;
            }
        }

        var real = Error(b);
        // A design's own subcircuit cannot be made faster: the ideal buffer and the searches use the macro-model of its
        // datasheet figures, and its share is not split into slew rate and bandwidth.
        var external = b.Subcircuit is not null;
        b = b with { Subcircuit = null };
        var noSlewLimit = b.SlewRateVoltsPerSecond is null || external ? real : Error(b with { SlewRateVoltsPerSecond = null });
        var ideal = Error(b with { GainBandwidthHertz = IdealFactor * b.GainBandwidthHertz, SlewRateVoltsPerSecond = null });
        double? gbw = null, slew = null;
        if (search && ideal <= allowed)
        {
            gbw = LowestFromAbove(b.GainBandwidthHertz * GainBandwidthFloorFactor, IdealFactor * b.GainBandwidthHertz,
                g => Settles(b with { GainBandwidthHertz = g, SlewRateVoltsPerSecond = null }));
            var atGbw = Math.Max(gbw ?? b.GainBandwidthHertz, b.GainBandwidthHertz);
            slew = LowestFromAbove(SlewRateFloorVoltsPerSecond, SlewRateCeilingVoltsPerSecond,
                s => Settles(b with { GainBandwidthHertz = atGbw, SlewRateVoltsPerSecond = s }));
        }
        var method = FormattableString.Invariant(
            $"sampling transients at {celsius:0.##} °C, {PrechargeCases.Describe(prechargeVolts)}: design op-amp against one with {IdealFactor:0}× the gain-bandwidth and no slew limit; ") +
            (external ? "your subcircuit against the macro-model of the design's datasheet figures, which the searches use too (the share is not split into slew rate and bandwidth); " : "") +
            (search ? $"scan down in half decades, then bisection ({SearchPrecision:P0}) on the simulated sample for ½ LSB; a candidate whose transient does not converge counts as not settling; a need at the search floor (GBW × {GainBandwidthFloorFactor:G2}, {EngineeringFormat.Format(SlewRateFloorVoltsPerSecond, UnitKind.VoltPerSecond, 2)}) means any op-amp down to it settles" : "searches skipped (--no-remedies)");
        return new RecoveryResult(celsius, prechargeVolts, real, noSlewLimit, ideal, allowed, gbw, slew, method) { GainBandwidthFloorHertz = b.GainBandwidthHertz * GainBandwidthFloorFactor };
    }

    /// <summary>
    /// The lowest value above which every value settles: a scan down from <paramref name="high"/> in steps of half a
    /// decade to the first value that does not, then bisection between it and the last that did. The error is not
    /// monotone in the op-amp's speed (a very slow loop barely reacts to a kick that r_o absorbs, a middling one reacts
    /// and has not recovered when the switch opens), so a plain bisection could land in a passing pocket below a
    /// failing band. Null when <paramref name="high"/> itself does not settle; <paramref name="low"/> when nothing down
    /// to it fails.
    /// </summary>
    private static double? LowestFromAbove(double low, double high, Func<double, bool> settles)
    {
        if (!settles(high)) return null;
        var step = Math.Sqrt(10);
        var passing = high;
        for (var x = high / step; x >= low * (1 - 1e-9); x /= step)
        {
            if (!settles(x))
                return MonotoneSearch.SmallestPassing(x, passing, settles, SearchPrecision);
            passing = x;
        }
        return passing > low && !settles(low) ? MonotoneSearch.SmallestPassing(low, passing, settles, SearchPrecision) : low;
    }
}
