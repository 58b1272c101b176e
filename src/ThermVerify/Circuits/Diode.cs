using ThermVerify.Circuits.Spice;

namespace ThermVerify.Circuits;

/// <summary>
/// Junction diode, Shockley equation I = Is·(exp(V/(n·Vt)) − 1) with Vt = kT/q at the circuit
/// temperature, and an optional series resistance. Is is the value at <see cref="SaturationReferenceCelsius"/>
/// when that is given and follows SPICE's temperature law (see <see cref="SaturationCurrentAmperesAt"/>);
/// otherwise it is used as given at every temperature. No junction capacitance, no breakdown.
/// Meant for input clamps.
/// </summary>
internal sealed record Diode(string Name, string Anode, string Cathode, double SaturationCurrentAmperes = 1e-14,
    double EmissionCoefficient = 1, double SeriesResistanceOhms = 0) : Element(Name)
{
    public override IReadOnlyList<string> Nodes => [Anode, Cathode];

    internal override IEnumerable<(string A, string B)> DcPaths => [(Anode, Cathode)];

    /// <summary>Temperature at which <see cref="SaturationCurrentAmperes"/> holds; null: no temperature scaling.</summary>
    public double? SaturationReferenceCelsius { get; init; }

    /// <summary>
    /// When given (with <see cref="SaturationReferenceCelsius"/>), Is doubles every this many kelvin instead of following
    /// the SPICE law: how a datasheet states a protection diode's reverse leakage (common practice, no source).
    /// </summary>
    public double? LeakageDoublingKelvin { get; init; }

    /// <summary>Band gap EG in eV for the temperature law (silicon 1.11, SPICE's default).</summary>
    public double BandGapElectronVolts { get; init; } = 1.11;

    /// <summary>Saturation-current temperature exponent XTI (3 for a pn junction, SPICE's default).</summary>
    public double SaturationExponent { get; init; } = 3;

    /// <summary>
    /// Is(T) = Is·(T/T0)^(XTI/n)·exp((T/T0 − 1)·EG/(n·Vt(T))), Vt = kT/q (the SPICE2 diode model's
    /// temperature law, Nagel 1975, from memory), or Is unchanged without a reference temperature.
    /// </summary>
    public double SaturationCurrentAmperesAt(double temperatureCelsius)
    {
        if (SaturationReferenceCelsius is not { } reference)
            return SaturationCurrentAmperes;
        if (LeakageDoublingKelvin is { } doubling)
            return Quantities.DoublingLaw.At(SaturationCurrentAmperes, reference, doubling, temperatureCelsius);
        var t = Quantities.PhysicalConstants.ToKelvin(temperatureCelsius);
        var ratio = t / Quantities.PhysicalConstants.ToKelvin(reference);
        var vt = Quantities.PhysicalConstants.ThermalVolts(temperatureCelsius);
        return SaturationCurrentAmperes * Math.Pow(ratio, SaturationExponent / EmissionCoefficient)
            * Math.Exp((ratio - 1) * BandGapElectronVolts / (EmissionCoefficient * vt));
    }

    internal override IReadOnlyList<ExtraUnknown> ExtraUnknowns =>
        SeriesResistanceOhms > 0 ? [ExtraUnknown.Voltage($"{Name}#junction")] : [];

    internal override void Validate()
    {
        base.Validate();
        ElementChecks.DistinctNodes(this, Anode, Cathode);
        ElementChecks.Positive(this, SaturationCurrentAmperes, "saturation current");
        ElementChecks.Positive(this, EmissionCoefficient, "emission coefficient");
        ElementChecks.NonNegative(this, SeriesResistanceOhms, "series resistance");
        if (SaturationReferenceCelsius is { } reference && !(double.IsFinite(reference) && reference > -Quantities.PhysicalConstants.ZeroCelsiusInKelvin))
            throw new CircuitException($"{Describe}: saturation reference temperature {reference} °C is not a physical temperature.");
        ElementChecks.Positive(this, BandGapElectronVolts, "band gap");
        ElementChecks.Finite(this, SaturationExponent, "saturation exponent");
        if (LeakageDoublingKelvin is { } doubling)
        {
            ElementChecks.Positive(this, doubling, "leakage doubling interval");
            if (SaturationReferenceCelsius is null || SeriesResistanceOhms != 0)
                throw new CircuitException($"{Describe}: a leakage doubling law needs a reference temperature and no series resistance.");
        }
    }

    /// <summary>
    /// xti = 0 and eg = 0 keep Is fixed with temperature, as in the built-in model. A doubling law has no SPICE model
    /// parameter, so that diode is written as a behavioural current source with the same Shockley equation and law,
    /// Vt = (k/q)·T at ngspice's circuit temperature.
    /// </summary>
    internal override void WriteSpice(SpiceLines deck)
    {
        if (LeakageDoublingKelvin is { } doubling && SaturationReferenceCelsius is { } reference && SeriesResistanceOhms == 0)
        {
            var kOverQ = Quantities.PhysicalConstants.BoltzmannJoulesPerKelvin / Quantities.PhysicalConstants.ElementaryChargeCoulombs;
            deck.Line($"{SpiceLines.InstanceName('B', Name)} {Anode} {Cathode} I={SpiceNumber.Format(SaturationCurrentAmperes)}" +
                      $"*pow(2,(temper-{SpiceNumber.Format(reference)})/{SpiceNumber.Format(doubling)})" +
                      $"*(exp(v({Anode},{Cathode})/({SpiceNumber.Format(EmissionCoefficient)}*{SpiceNumber.Format(kOverQ)}*(temper+{SpiceNumber.Format(Quantities.PhysicalConstants.ZeroCelsiusInKelvin)})))-1)");
            return;
        }
        var model = $"{Name}_model";
        // Referenced to the deck's TNOM, the built-in law is SPICE's own: the model carries its eg and xti.
        var law = SaturationReferenceCelsius == SpiceDeckWriter.NominalCelsius
            ? $"xti={SpiceNumber.Format(SaturationExponent)} eg={SpiceNumber.Format(BandGapElectronVolts)}"
            : "xti=0 eg=0";
        deck.Line($"{SpiceLines.InstanceName('D', Name)} {Anode} {Cathode} {model}");
        deck.Definition(model, $".model {model} d is={SpiceNumber.Format(SaturationCurrentAmperes)} n={SpiceNumber.Format(EmissionCoefficient)} " +
                               $"rs={SpiceNumber.Format(SeriesResistanceOhms)} {law} cjo=0");
    }
}
