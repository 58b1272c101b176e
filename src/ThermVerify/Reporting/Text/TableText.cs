using System.Text;
using ThermVerify.Firmware;
using ThermVerify.Provenance;
using static ThermVerify.Reporting.Text.TextNumbers;

namespace ThermVerify.Reporting.Text;

/// <summary>What `table` prints: the table's extent, its error against the true temperature, and the fault thresholds.</summary>
public static class TableText
{
    public static string Render(FirmwareTableRun run, RunProvenance provenance)
    {
        var (table, error, faults) = (run.Table, run.Error, run.Faults);
        var text = new StringBuilder();
        text.AppendLine($"table for {run.Design.Name}: codes {table.Span.FirstCode}..{table.Span.LastCode}, {table.Codes.Count} " +
                        $"{(table.IsDense ? "entries (every code)" : "breakpoints")}, unit {run.Request.Scale.Name}" +
                        (run.Request.CorrectForLoading ? ", corrected for the simulated DC loading" : ""));
        ProvenanceText.Append(text, provenance);
        var worstCode = Math.Abs(error.MaxErrorKelvin) >= Math.Abs(error.MinErrorKelvin) ? error.MaxErrorCode : error.MinErrorCode;
        text.AppendLine(Invariant(
            $"table error against the true temperature: {error.MinErrorKelvin:+0.0000;-0.0000} K to {error.MaxErrorKelvin:+0.0000;-0.0000} K (worst at code {worstCode}); the converter's own ½ LSB is up to {error.HalfCodeKelvin:0.0000} K"));
        text.AppendLine($"fault thresholds: code < {faults.FaultBelowCode} or code > {faults.FaultAboveCode} is a fault (valid codes {faults.LowestValidCode}..{faults.HighestValidCode})");
        return text.ToString();
    }
}
