using ThermVerify.Firmware;

namespace ThermVerify.Reporting.Text;

/// <summary>Fault thresholds in words, for the terminal summary of `check` and the JSON.</summary>
internal static class FaultText
{
    public static string Kind(FaultKind kind) => kind switch
    {
        FaultKind.SensorOpen => "sensor open",
        FaultKind.SensorShorted => "sensor shorted",
        FaultKind.FixedOpen => "fixed resistor open",
        FaultKind.FixedShorted => "fixed resistor shorted",
        FaultKind.OppositeHighOpen => "opposite high resistor open",
        FaultKind.OppositeHighShorted => "opposite high resistor shorted",
        FaultKind.OppositeLowOpen => "opposite low resistor open",
        FaultKind.OppositeLowShorted => "opposite low resistor shorted",
        _ => kind.ToString(),
    };

    public static string Render(FaultThresholds faults) =>
        $"Fault thresholds (with the design's tolerances): a code below {faults.FaultBelowCode} or above {faults.FaultAboveCode} is a fault; " +
        $"healthy codes span {faults.LowestValidCode}..{faults.HighestValidCode}; " +
        string.Join(", ", faults.Faults.Select(f => $"{Kind(f.Kind)} reads {(f.MinCode == f.MaxCode ? $"{f.MinCode}" : $"{f.MinCode}..{f.MaxCode}")}")) + ".";
}
