namespace Lookup.Calibration;

/// <summary>Calibration cannot run on this index; the message names the index, the numbers and the fix.</summary>
public sealed class CalibrationException : Exception
{
    /// <summary>Creates the exception.</summary>
    public CalibrationException(CalibrationProblem problem, string message)
        : base(message)
    {
        Problem = problem;
    }

    /// <summary>What is wrong.</summary>
    public CalibrationProblem Problem { get; }
}
