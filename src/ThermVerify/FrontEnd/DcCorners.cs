using ThermVerify.Design;

namespace ThermVerify.FrontEnd;

/// <summary>
/// The DC levels at the two corners of the design's bounds. Each static error given as a bound (<see cref="StaticBounds"/>)
/// is simulated on its own, at its size, on the design with every bound at zero (<see cref="Base"/>); at each
/// temperature the signs that raise the settled pin voltage (over the reference, where the circuit makes it) make the upper corner and the opposite signs the lower one,
/// and the levels there are the base plus or minus each error's simulated shift: superposition, exact for the linear DC
/// circuit (the op-amp's output clamp aside). A design with no bound has one corner, the design itself; a design whose
/// only bounds are the converter's has two corners with the same DC levels.
/// </summary>
internal sealed record DcCorners(DcLevels Base, IReadOnlyList<DcLevels> Corners, IReadOnlyList<CircuitBound> Bounds, IReadOnlyList<double[]> UpperSigns)
{
    public static DcCorners Run(FrontEndDesign design, IReadOnlyList<PrechargeCase> cases, IReadOnlyList<double> temperatures, ICheckEngine? engine = null)
    {
        var bounds = StaticBounds.InCircuit(design);
        var zeroed = StaticBounds.Zeroed(design);
        var baseLevels = DcLevels.Run(zeroed, cases, temperatures, engine);
        if (bounds.Count == 0)
            return new DcCorners(baseLevels, StaticBounds.Any(design) ? [baseLevels, baseLevels] : [baseLevels], bounds, []);

        var shifted = bounds.Select(b => DcLevels.Run(b.Set(zeroed, b.Magnitude), cases, temperatures, engine)).ToArray();
        // The upper corner raises the code: the pin over the reference where the circuit makes the reference.
        var signs = shifted.Select(s => temperatures.Select((_, i) => s.StaticRatio(i) >= baseLevels.StaticRatio(i) ? 1.0 : -1.0).ToArray()).ToArray();
        DcLevels Corner(double direction)
        {
            // Plain loops (the same sums in the same order as before): this runs for every Monte Carlo unit.
            double[] Add(Func<DcLevels, double[]> array)
            {
                var baseArray = array(baseLevels);
                var shiftedArrays = new double[bounds.Count][];
                for (var b = 0; b < bounds.Count; b++)
                    shiftedArrays[b] = array(shifted[b]);
                var result = new double[temperatures.Count];
                for (var i = 0; i < result.Length; i++)
                {
                    var sum = 0.0;
                    for (var b = 0; b < bounds.Count; b++)
                        sum += signs[b][i] * (shiftedArrays[b][i] - baseArray[i]);
                    result[i] = baseArray[i] + direction * sum;
                }
                return result;
            }
            return new DcLevels(baseLevels.DividerVolts,
                baseLevels.AfterBufferVolts is null ? null : Add(l => l.AfterBufferVolts!),
                Add(l => l.StaticPinVolts),
                [.. cases.Select((_, c) => Add(l => l.AveragePinVolts[c]))])
            {
                ReferenceVolts = baseLevels.ReferenceVolts is null ? null : Add(l => l.ReferenceVolts!),
                SourceVolts = baseLevels.SourceVolts is null ? null : Add(l => l.SourceVolts!),
                NegativeInputVolts = baseLevels.NegativeInputVolts is null ? null : Add(l => l.NegativeInputVolts!),
                SecondOutputVolts = baseLevels.SecondOutputVolts is null ? null : Add(l => l.SecondOutputVolts!),
                AmplifierOutputVolts = baseLevels.AmplifierOutputVolts is null ? null : Add(l => l.AmplifierOutputVolts!),
            };
        }
        return new DcCorners(baseLevels, [Corner(1), Corner(-1)], bounds, signs);
    }

    /// <summary>The design with each bound at the sign it has at corner <paramref name="corner"/> at point <paramref name="i"/> (for closed forms and words).</summary>
    public FrontEndDesign DesignAt(FrontEndDesign design, int corner, int i)
    {
        var x = StaticBounds.Zeroed(design);
        for (var b = 0; b < Bounds.Count; b++)
            x = Bounds[b].Set(x, (corner == 0 ? 1 : -1) * UpperSigns[b][i] * Bounds[b].Magnitude);
        return x;
    }
}
