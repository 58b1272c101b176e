using ThermVerify.Baselines;
using ThermVerify.Circuits;
using ThermVerify.Design;
using ThermVerify.Files;
using ThermVerify.Firmware;
using ThermVerify.Limits;
using ThermVerify.Quantities;
using ThermVerify.Sensors;
using ThermVerify.Simulation;

namespace ThermVerify.Api;

/// <summary>What kind of failure an exception from the library is, so a caller can react (and a command exit) by kind.</summary>
public enum FailureKind
{
    /// <summary>The input cannot be used: a design, a table, a value, a path, an engine that is not installed.</summary>
    BadInput,

    /// <summary>A simulation could not be completed: non-convergence, a singular circuit.</summary>
    SimulationFailed,

    /// <summary>The caller cancelled the work.</summary>
    Cancelled,

    /// <summary>None of the above: a bug in thermverify.</summary>
    Internal,
}

/// <summary>The one map from the library's exceptions to their kind.</summary>
public static class Failure
{
    /// <summary>
    /// Parallel work reports its failures wrapped (an aggregate, a type initialiser, a reflection call); the first
    /// inner failure is the one to explain. A cancellation among them explains nothing else, so a real failure in
    /// another branch wins over it.
    /// </summary>
    public static Exception Unwrap(Exception exception) => exception switch
    {
        AggregateException { InnerExceptions.Count: > 0 } aggregate =>
            Unwrap(aggregate.InnerExceptions.Select(Unwrap).FirstOrDefault(e => e is not OperationCanceledException) ?? aggregate.InnerExceptions[0]),
        TypeInitializationException { InnerException: { } inner } => Unwrap(inner),
        System.Reflection.TargetInvocationException { InnerException: { } inner } => Unwrap(inner),
        _ => exception,
    };

    public static FailureKind KindOf(Exception exception) => Unwrap(exception) switch
    {
        OperationCanceledException => FailureKind.Cancelled,
        DesignException or QuantityFormatException or SensorFitException or SensorRangeException or SensorTableException => FailureKind.BadInput,
        FirmwareInputException or TableFormatException or BaselineException or OutputExistsException => FailureKind.BadInput,
        OutputPathException or InputFileException => FailureKind.BadInput,
        FileNotFoundException or DirectoryNotFoundException or UnauthorizedAccessException => FailureKind.BadInput,
        EngineUnsupportedException or ConverterUnsupportedException => FailureKind.BadInput,
        SimulationException or CircuitException or TimeLimitException => FailureKind.SimulationFailed,
        OutputRenderException { Failure: RenderFailure.UnwritableText } => FailureKind.BadInput,
        OutputRenderException => FailureKind.SimulationFailed,
        _ => FailureKind.Internal,
    };
}
