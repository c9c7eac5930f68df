namespace Parity;

/// <summary>
/// Thrown by <see cref="ParityGate.AssertStable"/> when a script is not stable against its golden snapshots.
/// The message is the text <c>parity check</c> prints for the same scripts, so a test failure reads like
/// the CI gate. Test frameworks report it as a failed test.
/// </summary>
public sealed class ParityUnstableException : Exception
{
    /// <summary>An exception for the gate result <paramref name="result"/>.</summary>
    public ParityUnstableException(ParityResult result)
        : base(result.Text)
    {
        Result = result;
    }

    /// <summary>An exception with a message and no result.</summary>
    public ParityUnstableException(string message)
        : base(message)
    {
    }

    /// <summary>An exception with a message, the exception behind it and no result.</summary>
    public ParityUnstableException(string message, Exception inner)
        : base(message, inner)
    {
    }

    /// <summary>An exception without details.</summary>
    public ParityUnstableException()
        : this("the script is not stable against its golden snapshots")
    {
    }

    /// <summary>The gate result: findings, golden mismatches and checkpoints; null when made from a message.</summary>
    public ParityResult? Result { get; }
}
