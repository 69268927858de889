namespace Lookup.Tests.Slurm;

/// <summary>
/// A test that starts a local Slurm cluster. It runs everywhere, CI included, and is skipped only when the
/// environment says LOOKUP_SKIP_SLURM=1, for a machine where daemons cannot be started; .ci/run never sets it.
/// A missing package is a failure with the install command, not a skip.
/// </summary>
[AttributeUsage(AttributeTargets.Method)]
public sealed class SlurmFactAttribute : FactAttribute
{
    public const string SkipVariable = "LOOKUP_SKIP_SLURM";

    public SlurmFactAttribute()
    {
        if (Environment.GetEnvironmentVariable(SkipVariable) == "1")
        {
            Skip = $"{SkipVariable}=1 is set: this machine is declared unable to run a local Slurm cluster " +
                   "(munged, slurmctld and slurmd started by tools/slurm/local-cluster.sh). CI never sets it.";
        }
    }
}
