using ThermVerify.Design;

namespace ThermVerify.Firmware;

/// <summary>A design's code-to-temperature table with its error, fault thresholds and the content of its C header.</summary>
public sealed record FirmwareTableRun(
    FrontEndDesign Design,
    TableRequest Request,
    FirmwareModel Model,
    FirmwareTable Table,
    TableError Error,
    FaultThresholds Faults,
    FirmwareHeaderContent Header)
{
    /// <summary>Builds the table as asked; the header content is validated so that a header can always be written.</summary>
    public static FirmwareTableRun Build(FrontEndDesign design, TableRequest request)
    {
        var model = FirmwareFromDesign.Model(design, request.CorrectForLoading);
        var table = request.Breakpoints is { } n ? TableBuilder.WithBreakpoints(model, request.Scale, n)
            : request.BoundKelvin is { } bound ? TableBuilder.WithinBound(model, request.Scale, bound)
            : TableBuilder.EveryCode(model, request.Scale);
        var error = TableErrorAnalysis.Evaluate(model, table);
        var faults = FaultAnalysis.Thresholds(model, FirmwareFromDesign.Tolerances(design));
        var coefficients = design.Sensor is RtdSensorSpec ? null : ComputedCoefficients.Fit(model);
        var header = new FirmwareHeaderContent(design.Name, request.Prefix ?? CIdentifiers.PrefixFor(design.Name), model, table, error, faults, coefficients);
        return new FirmwareTableRun(design, request, model, table, error, faults, header.Validated());
    }
}
