using ThermVerify.Design;

namespace ThermVerify.Tolerances;

/// <summary>
/// Every nonzero tolerance of a design, in a fixed order. A unit is a vector of deviations, one per parameter,
/// in the parameter's own unit. Values the design gives as bounds without a nominal (fixed-resistor tempco, op-amp
/// offset, drift and bias, ADC offset, gain error and INL, reference tempco) are spread over ±|bound| around zero, so
/// the unit with every deviation zero has them at zero: <see cref="UnitEvaluator.NominalUnitDesign"/>.
/// </summary>
internal sealed class ToleranceSet
{
    private ToleranceSet(IReadOnlyList<ToleranceParameter> parameters) => Parameters = parameters;

    public IReadOnlyList<ToleranceParameter> Parameters { get; }

    public int Count => Parameters.Count;

    public int IndexOf(ToleranceKind kind)
    {
        for (var i = 0; i < Parameters.Count; i++)
            if (Parameters[i].Kind == kind)
                return i;
        return -1;
    }

    /// <summary>The parameter of this kind that moves the netlist element <paramref name="element"/>; −1 when there is none.</summary>
    public int IndexOf(ToleranceKind kind, string element)
    {
        for (var i = 0; i < Parameters.Count; i++)
            if (Parameters[i].Kind == kind && string.Equals(Parameters[i].Element, element, StringComparison.OrdinalIgnoreCase))
                return i;
        return -1;
    }

    public static ToleranceSet From(FrontEndDesign design)
    {
        var d = ToleranceDistribution.Of(design.Tolerances);
        var list = new List<ToleranceParameter>();
        void Add(ToleranceKind kind, string key, double halfWidth, string unit, bool signed = false, string? element = null)
        {
            // A value written with its sign is known, not spread: every unit has it as written.
            if (halfWidth != 0 && !signed) list.Add(new ToleranceParameter(kind, key, Math.Abs(halfWidth), unit, d) { Element = element });
        }

        switch (design.Sensor)
        {
            case BetaSensorSpec b:
                Add(ToleranceKind.SensorResistance, "sensor.resistance_tolerance", b.ResistanceTolerance, "");
                Add(ToleranceKind.SensorBeta, "sensor.beta_tolerance", b.BetaTolerance, "");
                break;
            case SteinhartHartSensorSpec sh:
                Add(ToleranceKind.SensorResistance, "sensor.resistance_tolerance", sh.ResistanceTolerance, "");
                break;
            case TableSensorSpec t:
                Add(ToleranceKind.SensorResistance, "sensor.resistance_tolerance", t.ResistanceTolerance, "");
                break;
            case RtdSensorSpec r when r.ToleranceClass is not null:
                Add(ToleranceKind.RtdClass, "sensor.class", 1, "class band");
                break;
        }
        // A netlist's parts take the place of the divider's, in the order [[netlist.part]] gives them (value, then tempco),
        // so that a netlist redrawing of a divider draws the same deviations from the same seed.
        if (design.Netlist is { } netlist)
            foreach (var part in netlist.Parts)
            {
                Add(ToleranceKind.NetlistPartValue, $"netlist.part.{part.Name}.tolerance", part.Tolerance, "", element: part.Name);
                Add(ToleranceKind.NetlistPartTempco, $"netlist.part.{part.Name}.tempco", part.TempcoPerKelvin, "1/K", part.TempcoSigned, part.Name);
            }
        if (design.Divider is { } divider)
        {
            var section = design.Bridge is null ? "divider" : "bridge";
            Add(ToleranceKind.FixedResistance, $"{section}.fixed_tolerance", divider.FixedTolerance, "");
            Add(ToleranceKind.FixedTempco, $"{section}.fixed_tempco", divider.FixedTempcoPerKelvin, "1/K", divider.FixedTempcoSigned);
            Add(ToleranceKind.Excitation, $"{section}.excitation_tolerance", divider.ExcitationTolerance, "");
        }
        if (design.Bridge is { } bridge)
        {
            Add(ToleranceKind.BridgeHighResistance, "bridge.opposite_high_tolerance", bridge.HighTolerance, "");
            Add(ToleranceKind.BridgeHighTempco, "bridge.opposite_high_tempco", bridge.HighTempcoPerKelvin, "1/K", bridge.HighTempcoSigned);
            Add(ToleranceKind.BridgeLowResistance, "bridge.opposite_low_tolerance", bridge.LowTolerance, "");
            Add(ToleranceKind.BridgeLowTempco, "bridge.opposite_low_tempco", bridge.LowTempcoPerKelvin, "1/K", bridge.LowTempcoSigned);
        }
        if (design.CurrentSource is { } source)
        {
            Add(ToleranceKind.Current, "current_source.current_tolerance", source.CurrentTolerance, "");
            Add(ToleranceKind.CurrentTempco, "current_source.current_tempco", source.CurrentTempcoPerKelvin, "1/K", source.CurrentTempcoSigned);
            Add(ToleranceKind.ReferenceResistance, "current_source.reference_resistor_tolerance", source.ReferenceResistorTolerance, "");
            Add(ToleranceKind.ReferenceResistorTempco, "current_source.reference_resistor_tempco", source.ReferenceResistorTempcoPerKelvin, "1/K",
                source.ReferenceResistorTempcoSigned);
        }
        if (design.Wiring is { Wires: 3 } wiring)
        {
            Add(ToleranceKind.CurrentMismatch, "wiring.current_mismatch", wiring.CurrentMismatch, "", wiring.CurrentMismatchSigned);
            Add(ToleranceKind.LeadMismatch, "wiring.lead_mismatch", wiring.LeadMismatch, "", wiring.LeadMismatchSigned);
        }
        var adc = design.Adc;
        if (!adc.IsRatiometric)
        {
            Add(ToleranceKind.Reference, "adc.reference_tolerance", adc.ReferenceTolerance, "");
            Add(ToleranceKind.ReferenceTempco, "adc.reference_tempco", adc.ReferenceTempcoPerKelvin, "1/K", adc.ReferenceTempcoSigned);
        }
        Add(ToleranceKind.AdcOffset, "adc.offset_error", adc.OffsetErrorLsb, "LSB", adc.OffsetErrorSigned);
        Add(ToleranceKind.AdcGain, "adc.gain_error", adc.GainError, "", adc.GainErrorSigned);
        Add(ToleranceKind.AdcInl, "adc.inl", adc.InlLsb, "LSB");
        if (adc.GainStage is { } stage)
        {
            Add(ToleranceKind.GainStageGain, "adc.pga_gain_error", stage.GainError, "", stage.GainErrorSigned);
            Add(ToleranceKind.GainStageInputCurrent, "adc.pga_input_current", stage.InputCurrentAmperes, "A", stage.InputCurrentSigned);
        }
        if (adc.DeltaSigma is { InputBuffered: true } deltaSigma)
            Add(ToleranceKind.DeltaSigmaInputCurrent, "adc.input_current", deltaSigma.InputCurrentAmperes, "A", deltaSigma.InputCurrentSigned);
        if (design.Buffer is { } buffer)
        {
            Add(ToleranceKind.BufferOffset, "buffer.offset_voltage", buffer.OffsetVolts, "V", buffer.OffsetSigned);
            Add(ToleranceKind.BufferDrift, "buffer.offset_drift", buffer.OffsetDriftVoltsPerKelvin, "V/K", buffer.OffsetDriftSigned);
            Add(ToleranceKind.BufferBias, "buffer.bias_current", buffer.BiasCurrentAmperes, "A", buffer.BiasCurrentSigned);
        }
        if (design.Amplifier is { } amplifier)
        {
            Add(ToleranceKind.AmplifierOffset, "amplifier.offset_voltage", amplifier.OffsetVolts, "V", amplifier.OffsetSigned);
            Add(ToleranceKind.AmplifierDrift, "amplifier.offset_drift", amplifier.OffsetDriftVoltsPerKelvin, "V/K", amplifier.OffsetDriftSigned);
            Add(ToleranceKind.AmplifierGainError, "amplifier.gain_error", amplifier.GainError, "", amplifier.GainErrorSigned);
            Add(ToleranceKind.AmplifierCommonMode, "amplifier.cmrr", amplifier.CommonModeFraction, "");
            Add(ToleranceKind.AmplifierBias, "amplifier.bias_current", amplifier.BiasCurrentAmperes, "A", amplifier.BiasCurrentSigned);
        }
        if (design.Protection is { HasClamps: true } protection)
            Add(ToleranceKind.ClampLeakage, "protection.clamp_leakage", protection.ClampLeakageAmperes, "A", protection.ClampLeakageSigned);
        if (adc.PinLeakageAmperes != 0 || adc.NegativeInput is { PinLeakageAmperes: not 0 })
            Add(ToleranceKind.Leakage, "tolerances.leakage_spread", design.Tolerances.LeakageSpread, "");
        return new ToleranceSet(list);
    }

    /// <summary>The deviations of one unit, drawn from its own stream.</summary>
    internal double[] Sample(ref UnitRandom random)
    {
        var deviations = new double[Parameters.Count];
        for (var i = 0; i < deviations.Length; i++)
            deviations[i] = Parameters[i].Distribution.Sample(ref random, Parameters[i].HalfWidth);
        return deviations;
    }

    /// <summary>The corner of the tolerance box with the given signs (+1 or −1 per parameter).</summary>
    public double[] Corner(IReadOnlyList<int> signs) => [.. Parameters.Select((p, i) => signs[i] * p.HalfWidth)];
}
