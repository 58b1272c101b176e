namespace ThermVerify.Circuits;

/// <summary>
/// SPICE-style pulse: <see cref="Initial"/> until <see cref="DelaySeconds"/>, a linear rise to
/// <see cref="Pulsed"/>, held for <see cref="WidthSeconds"/>, a linear fall, repeated every
/// <see cref="PeriodSeconds"/> (0 or ∞: a single pulse). Zero rise or fall gives an ideal step.
/// </summary>
internal sealed record PulseWaveform(double Initial, double Pulsed, double DelaySeconds, double RiseSeconds,
    double FallSeconds, double WidthSeconds, double PeriodSeconds) : Waveform
{
    private bool Repeats => PeriodSeconds > 0 && double.IsFinite(PeriodSeconds);

    public override double ValueAt(double timeSeconds)
    {
        var tau = timeSeconds - DelaySeconds;
        if (tau <= 0)
            return Initial;
        if (Repeats)
        {
            tau -= Math.Floor(tau / PeriodSeconds) * PeriodSeconds;
            if (tau <= 0)
                return Initial;
        }
        if (tau <= RiseSeconds)
            return Initial + (Pulsed - Initial) * tau / RiseSeconds;
        tau -= RiseSeconds;
        if (tau <= WidthSeconds)
            return Pulsed;
        tau -= WidthSeconds;
        if (tau <= FallSeconds)
            return Pulsed + (Initial - Pulsed) * tau / FallSeconds;
        return Initial;
    }

    internal override void CollectBreakpoints(double fromSeconds, double toSeconds, List<double> into)
    {
        double[] corners = [0, RiseSeconds, RiseSeconds + WidthSeconds, RiseSeconds + WidthSeconds + FallSeconds];
        var first = Repeats ? Math.Max(0, Math.Floor((fromSeconds - DelaySeconds) / PeriodSeconds) - 1) : 0;
        for (var k = first; ; k++)
        {
            var start = DelaySeconds + (Repeats ? k * PeriodSeconds : 0);
            if (start > toSeconds)
                return;
            foreach (var c in corners)
                if (start + c >= fromSeconds && start + c <= toSeconds)
                    into.Add(start + c);
            if (!Repeats)
                return;
        }
    }

    /// <summary>SPICE replaces a zero rise or fall by its print step; 1 ps keeps the step as sharp as SPICE allows.</summary>
    internal override string ToSpice()
    {
        static string F(double v) => Spice.SpiceNumber.Format(v);
        var edge = Spice.SwitchControl.EdgeSeconds;
        return $"PULSE({F(Initial)} {F(Pulsed)} {F(DelaySeconds)} {F(RiseSeconds > 0 ? RiseSeconds : edge)} " +
               $"{F(FallSeconds > 0 ? FallSeconds : edge)} {F(WidthSeconds)} {F(Repeats ? PeriodSeconds : 0)})";
    }

    internal override void Validate(Element owner)
    {
        ElementChecks.Finite(owner, Initial, "pulse initial value");
        ElementChecks.Finite(owner, Pulsed, "pulse value");
        ElementChecks.NonNegative(owner, DelaySeconds, "pulse delay");
        ElementChecks.NonNegative(owner, RiseSeconds, "pulse rise time");
        ElementChecks.NonNegative(owner, FallSeconds, "pulse fall time");
        ElementChecks.NonNegative(owner, WidthSeconds, "pulse width");
        if (double.IsNaN(PeriodSeconds) || PeriodSeconds < 0)
            throw new CircuitException($"{owner.Describe}: pulse period is {PeriodSeconds}; give 0 for a single pulse or a positive period.");
        if (Repeats && PeriodSeconds < RiseSeconds + WidthSeconds + FallSeconds)
            throw new CircuitException($"{owner.Describe}: pulse period {PeriodSeconds:G6} s is shorter than rise + width + fall; lengthen the period.");
    }
}
