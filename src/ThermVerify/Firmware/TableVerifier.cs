using System.Globalization;
using ThermVerify.Sensors;
using ThermVerify.Quantities;

namespace ThermVerify.Firmware;

/// <summary>
/// Checks a firmware table row by row against the true temperature at each code, and, when rows disagree, tries the
/// simple causes in turn: a wrong β (Beta sensors), a wrong fixed resistor, the sensor on the other side of the
/// divider, two rows swapped, one row out of place, rows out of code order. A cause is named only when assuming it
/// brings every row within the budget.
/// </summary>
internal static class TableVerifier
{
    /// <summary>Wide valid range for candidate β models, so a candidate never refuses a row the fit needs to see.</summary>
    private static readonly TemperatureRange CandidateRange = new(-150, 400);

    public static TableVerification Verify(FirmwareModel model, IReadOnlyList<TableRow> rows, double budgetKelvin)
    {
        model.Validated();
        ArgumentNullException.ThrowIfNull(rows);
        if (!(budgetKelvin > 0 && double.IsFinite(budgetKelvin)))
            throw new FirmwareInputException(FormattableString.Invariant($"The budget is {budgetKelvin} K; give a positive number of kelvin."));
        if (rows.Count == 0)
            throw new FirmwareInputException("The table has no rows to verify.");
        foreach (var row in rows)
            if (row.Code > model.Adc.MaxCode)
                throw new FirmwareInputException($"Line {row.Line}: code {row.Code} is above the {model.Adc.Bits}-bit converter's full scale {model.Adc.MaxCode}; check the ADC resolution.");
            else if (row.Code < model.Adc.MinCode)
                throw new FirmwareInputException($"Line {row.Line}: code {row.Code} is below the converter's lowest code {model.Adc.MinCode}; {(model.Adc.Bipolar ? "check the ADC resolution" : "an unsigned converter reads no negative codes: check adc.input")}.");

        var truth = Truth(model, rows);
        var disagreements = rows.Select((r, i) => new RowDisagreement(r, truth[i]))
            .Where(d => !(Math.Abs(d.ErrorKelvin) <= budgetKelvin)).ToList();
        var maxAbs = rows.Select((r, i) => Math.Abs(r.Celsius - truth[i])).Max();

        var causes = new List<TableCause>();
        causes.AddRange(OutOfOrder(rows));
        causes.AddRange(NotMonotonic(rows));
        if (disagreements.Count > 0)
        {
            causes.AddRange(RowDefects(rows, truth, disagreements, budgetKelvin));
            if (causes.All(c => c.Kind is TableCauseKind.RowsOutOfOrder or TableCauseKind.NotMonotonic))
                causes.AddRange(ModelCauses(model, rows, budgetKelvin));
        }
        return new TableVerification(rows.Count, budgetKelvin, maxAbs, disagreements, causes, BetweenRows(model, rows));
    }

    /// <summary>Straight-line reading between neighbouring rows (by code) at every code the rows skip.</summary>
    private static InterpolationError? BetweenRows(FirmwareModel model, IReadOnlyList<TableRow> rows)
    {
        var sorted = rows.OrderBy(r => r.Code).ToArray();
        InterpolationError? worst = null;
        for (var i = 1; i < sorted.Length; i++)
        {
            var (a, b) = (sorted[i - 1], sorted[i]);
            for (var code = a.Code + 1; code < b.Code; code++)
            {
                var read = a.Celsius + (b.Celsius - a.Celsius) * (code - a.Code) / (b.Code - a.Code);
                var error = Math.Abs(read - CodeTemperatures.TrueCelsius(model, code));
                if (double.IsNaN(error)) error = double.PositiveInfinity;
                if (worst is null || error > worst.MaxAbsErrorKelvin) worst = new InterpolationError(error, code);
            }
        }
        return worst;
    }

    private static double[] Truth(FirmwareModel model, IReadOnlyList<TableRow> rows) =>
        [.. rows.Select(r => CodeTemperatures.TrueCelsius(model, r.Code))];

    private static IEnumerable<TableCause> OutOfOrder(IReadOnlyList<TableRow> rows)
    {
        var lines = new List<int>();
        for (var i = 1; i < rows.Count; i++)
            if (rows[i].Code < rows[i - 1].Code) lines.Add(rows[i].Line);
        if (lines.Count > 0)
            yield return new TableCause(TableCauseKind.RowsOutOfOrder,
                $"Codes do not rise at {LineList(lines)}; a firmware search over the codes needs them in rising order.", null, 0, lines);
    }

    /// <summary>
    /// Rows whose temperature steps against the table's own direction (by code order), even within the budget:
    /// firmware that interpolates across such a step or searches the table by temperature misbehaves there.
    /// A table that runs the other way throughout is not flagged here; its rows disagree with the model instead.
    /// </summary>
    private static IEnumerable<TableCause> NotMonotonic(IReadOnlyList<TableRow> rows)
    {
        var sorted = rows.OrderBy(r => r.Code).ToArray();
        var steps = Enumerable.Range(1, sorted.Length - 1).Select(i => Math.Sign(sorted[i].Celsius - sorted[i - 1].Celsius)).ToArray();
        var rising = steps.Count(s => s > 0) >= steps.Count(s => s < 0);
        var lines = Enumerable.Range(1, sorted.Length - 1).Where(i => steps[i - 1] == (rising ? -1 : 1)).Select(i => sorted[i].Line).ToList();
        if (lines.Count > 0)
            yield return new TableCause(TableCauseKind.NotMonotonic,
                $"The temperature steps against the rest of the table at {LineList(lines)} (it otherwise {(rising ? "rises" : "falls")} with code); look for swapped or misplaced rows there.",
                null, 0, lines);
    }

    /// <summary>"line 7" or "lines 3, 4, 5 … (40 lines)": long lists are cut so a message stays readable.</summary>
    private static string LineList(IReadOnlyList<int> lines) =>
        lines.Count == 1 ? $"line {lines[0]}"
        : lines.Count <= 8 ? $"lines {string.Join(", ", lines)}"
        : $"lines {string.Join(", ", lines.Take(8))} … ({lines.Count} lines)";

    private static IEnumerable<TableCause> RowDefects(IReadOnlyList<TableRow> rows, double[] truth, List<RowDisagreement> bad, double budget)
    {
        if (bad.Count == 2)
        {
            var (i, j) = (Index(rows, bad[0].Row), Index(rows, bad[1].Row));
            if (Math.Abs(rows[i].Celsius - truth[j]) <= budget && Math.Abs(rows[j].Celsius - truth[i]) <= budget)
            {
                yield return new TableCause(TableCauseKind.SwappedRows, Invariant(
                    $"The temperatures on lines {rows[i].Line} (code {rows[i].Code}) and {rows[j].Line} (code {rows[j].Code}) are swapped; exchange them."),
                    null, 0, [rows[i].Line, rows[j].Line]);
                yield break;
            }
        }
        if (bad.Count == 1)
        {
            var row = bad[0].Row;
            yield return new TableCause(TableCauseKind.RowOutOfPlace, Invariant(
                $"Only line {row.Line} (code {row.Code}) disagrees: {row.Celsius:0.###} °C where the model gives {bad[0].ModelCelsius:0.###} °C; the row is out of place or mistyped."),
                null, 0, [row.Line]);
        }
    }

    private static IEnumerable<TableCause> ModelCauses(FirmwareModel model, IReadOnlyList<TableRow> rows, double budget)
    {
        if (model.Sensor is BetaThermistor beta)
        {
            FirmwareModel WithBeta(double b) => model with { Sensor = new BetaThermistor(beta.R0Ohms, b, beta.T0Celsius, CandidateRange) };
            var fitted = ParameterSearch.Minimise(b => Rms(WithBeta(b), rows), beta.Beta / 2, beta.Beta * 2);
            var residual = MaxResidual(WithBeta(fitted), rows);
            if (residual <= budget)
                yield return new TableCause(TableCauseKind.WrongBeta, Invariant(
                    $"The table matches β = {fitted:0.#} K, not the model's {beta.Beta:0.#} K (worst row then {residual:0.###} K off); the table was made with another β."),
                    fitted, residual, []);
        }
        // A current-excited model or a netlist has no fixed resistor in its transfer and no side to swap.
        if (model.ExcitationAmperes is not null || model.Netlist is not null) yield break;
        {
            FirmwareModel WithFixed(double r) => model with { FixedOhms = r };
            var fitted = ParameterSearch.Minimise(r => Rms(WithFixed(r), rows), model.FixedOhms / 10, model.FixedOhms * 10);
            var residual = MaxResidual(WithFixed(fitted), rows);
            if (residual <= budget)
                yield return new TableCause(TableCauseKind.WrongFixedResistor, Invariant(
                    $"The table matches a fixed resistor of {EngineeringFormat.Format(fitted, UnitKind.Ohm, 5)}, not the model's {EngineeringFormat.Format(model.FixedOhms, UnitKind.Ohm, 5)} (worst row then {residual:0.###} K off)."),
                    fitted, residual, []);
        }
        {
            var residual = MaxResidual(model.WithOtherSide(), rows);
            if (residual <= budget)
                yield return new TableCause(TableCauseKind.SensorOnOtherSide, Invariant(
                    $"The table matches the sensor on the {model.WithOtherSide().Side.ToString().ToLowerInvariant()} side of {(model.Bridge is null ? "the divider" : "the bridge's sensor half")}, not the {model.Side.ToString().ToLowerInvariant()} side (worst row then {residual:0.###} K off)."),
                    null, residual, []);
        }
    }

    /// <summary>Root-mean-square residual in K; a row the candidate cannot place counts as 1000 K so the search avoids it.</summary>
    private static double Rms(FirmwareModel candidate, IReadOnlyList<TableRow> rows) =>
        Math.Sqrt(Residuals(candidate, rows).Select(e => e * e).Average());

    private static double MaxResidual(FirmwareModel candidate, IReadOnlyList<TableRow> rows) => Residuals(candidate, rows).Max();

    private static IEnumerable<double> Residuals(FirmwareModel candidate, IReadOnlyList<TableRow> rows) =>
        rows.Select(r => CodeTemperatures.TrueCelsius(candidate, r.Code)).Select((t, i) => double.IsNaN(t) ? 1000 : Math.Abs(rows[i].Celsius - t));

    private static int Index(IReadOnlyList<TableRow> rows, TableRow row)
    {
        for (var i = 0; i < rows.Count; i++) if (rows[i] == row) return i;
        return -1;
    }

    private static string Invariant(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
