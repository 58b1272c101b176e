using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Sensors;

namespace ThermVerify.Firmware;

/// <summary>The firmware model of a design, optionally corrected for the simulated DC loading, and its fault tolerances.</summary>
internal static class FirmwareFromDesign
{
    /// <summary>
    /// The design's divider and converter over its check range. With <paramref name="correctForLoading"/> the pin's
    /// simulated DC offset from the unloaded divider (leakage, bias currents, fixed-resistor drift, and the average
    /// sampling current where a reservoir and a known precharge level make it steady) becomes the loading correction,
    /// interpolated linearly in the unloaded voltage between the sweep's points.
    /// </summary>
    public static FirmwareModel Model(FrontEndDesign design, bool correctForLoading)
    {
        // A delta-sigma converter's code is its static transfer, the same AdcTransfer; only its loading differs.
        if (correctForLoading && design.Adc.Kind == ConverterKind.DeltaSigma)
            return DeltaSigmaFirmware.Corrected(design, Model(design, correctForLoading: false));
        if (design.Bridge is { } bridge)
            return BridgeModel(design, bridge, correctForLoading);
        if (design.CurrentSource is { } source)
            return CurrentModel(design, source, correctForLoading);
        var closedForm = new ClosedFormModel(design);
        // A netlist's table inverts its ideal transfer (docs/netlists.md); the divider's fields are not used.
        var model = design.Netlist is { } netlist
            ? new FirmwareModel(closedForm.Sensor, SensorSide.Low, double.NaN, double.NaN, closedForm.Adc, design.Check.Range) { Netlist = netlist }
            : DividerModel(design, closedForm);
        if (!correctForLoading) return model.Validated();

        var temperatures = SensorTabulation.Grid(design.Check.Range, design.Check.StepKelvin).ToArray();
        // One known precharge level makes the average sampling current steady; with several (or "worst") there is no one correction.
        IReadOnlyList<PrechargeCase> cases = PrechargeCases.For(design, closedForm.Adc.ReferenceVolts) is [var only] ? [only] : [PrechargeCase.LastSample];
        var dc = DcLevels.Run(design, cases, temperatures);
        var gain = closedForm.BufferGain;
        var points = temperatures
            .Select((t, i) => (Unloaded: closedForm.At(t).IdealVolts / gain, Offset: (dc.AveragePinVolts[0][i] - closedForm.At(t).IdealVolts) / gain))
            .OrderBy(p => p.Unloaded).ToArray();
        return (model with { LoadingCorrectionVolts = v => Interpolate(points, v) }).Validated();
    }

    /// <summary>
    /// A current-excited sensor: the node is I·R_s (the leads of 3 or 4 wires cancel in the closed form) on the
    /// converter's scale at the pin. The loading correction is made for a divider only.
    /// </summary>
    private static FirmwareModel CurrentModel(FrontEndDesign design, CurrentSourceSpec source, bool correctForLoading)
    {
        if (correctForLoading)
            throw NoLoadingCorrection("excites its sensor with a current source");
        var closedForm = new ClosedFormModel(design);
        var fixedOhms = source.ReferenceResistorOhms ?? design.NominalReferenceVolts / source.CurrentAmperes;
        return new FirmwareModel(closedForm.Sensor, SensorSide.Low, fixedOhms, source.CurrentAmperes * fixedOhms, closedForm.Adc, design.Check.Range)
        {
            ExcitationAmperes = source.CurrentAmperes,
        }.Validated();
    }

    private static FirmwareInputException NoLoadingCorrection(string whatTheDesignIs) => new(
        $"The loading correction is made for a divider; this design {whatTheDesignIs}, whose correction is not made yet. " +
        "Make the table without it (leave out --corrected); check shows the DC loading the table then leaves.");

    /// <summary>
    /// A bridge: the code stands for V_d (signed codes on a differential input), or for an amplifier's output
    /// G′·(V_d + V_os′) with the gain and the offset the designer declares (<see cref="FirmwareAmplifier"/>), inverted
    /// through the bridge equation with the nominal halves. The loading correction is refused.
    /// </summary>
    private static FirmwareModel BridgeModel(FrontEndDesign design, BridgeSpec bridge, bool correctForLoading)
    {
        if (correctForLoading)
            throw NoLoadingCorrection("is a bridge");
        var closedForm = new ClosedFormModel(design);
        var half = design.Divider ?? throw new FirmwareInputException("The bridge has no sensor half ([bridge] sensor_side, fixed_resistor, excitation); give them.");
        return new FirmwareModel(closedForm.Sensor, half.SensorSide, half.FixedResistorOhms, half.ExcitationVolts, closedForm.Adc, design.Check.Range)
        {
            Bridge = bridge,
            Amplifier = design.Amplifier is { } a ? FirmwareAmplifier.Of(a, design, half.ExcitationVolts) : null,
        }.Validated();
    }

    private static FirmwareModel DividerModel(FrontEndDesign design, ClosedFormModel closedForm)
    {
        var divider = design.Divider ?? throw new FirmwareInputException(
            "Firmware tables are made for a divider, a current-excited sensor or a netlist; this design has none of them.");
        return new FirmwareModel(closedForm.Sensor, divider.SensorSide, divider.FixedResistorOhms, divider.ExcitationVolts, closedForm.Adc, design.Check.Range);
    }

    public static FaultTolerances Tolerances(FrontEndDesign design) => design.CurrentSource is { } source
        ? new FaultTolerances(ExcitationFraction: source.CurrentTolerance,
            ReferenceFraction: source.ReferenceResistorOhms is null ? design.Adc.ReferenceTolerance + ReferenceDriftFraction(design) : 0,
            FixedResistorFraction: source.ReferenceResistorTolerance,
            ExcitationTracksReference: source.ReferenceResistorOhms is not null)
        : new(
        ExcitationFraction: design.Divider?.ExcitationTolerance ?? 0,
        ReferenceFraction: design.Adc.ReferenceTolerance + ReferenceDriftFraction(design),
        FixedResistorFraction: design.Divider?.FixedTolerance ?? 0,
        ExcitationTracksReference: design.Adc.IsRatiometric,
        OppositeHighFraction: design.Bridge?.HighTolerance ?? 0,
        OppositeLowFraction: design.Bridge?.LowTolerance ?? 0);

    /// <summary>
    /// The largest relative drift of a fixed reference from 25 °C where it sits: at the board temperature, or over the
    /// whole check range when the board follows the sweep. A tempco with a sign drifts one way only, but the other corner
    /// is still its tolerance, so the drift widens the band by its size (a thresholds' margin, not a reading).
    /// </summary>
    public static double ReferenceDriftFraction(FrontEndDesign design)
    {
        if (design.Adc.IsRatiometric) return 0;
        var range = design.Check.Range;
        var farthest = design.Check.BoardCelsius is { } board
            ? Math.Abs(board - 25)
            : Math.Max(Math.Abs(range.MinCelsius - 25), Math.Abs(range.MaxCelsius - 25));
        return Math.Abs(design.Adc.ReferenceTempcoPerKelvin) * farthest;
    }

    internal static double Interpolate((double Unloaded, double Offset)[] points, double volts)
    {
        if (volts <= points[0].Unloaded) return points[0].Offset;
        if (volts >= points[^1].Unloaded) return points[^1].Offset;
        var i = Array.FindIndex(points, p => p.Unloaded >= volts);
        var (a, b) = (points[i - 1], points[i]);
        return a.Offset + (b.Offset - a.Offset) * (volts - a.Unloaded) / (b.Unloaded - a.Unloaded);
    }
}
