namespace GlobalFit.Inference.LinearAlgebra;

/// <summary>Allocation-free kernels on small dense row-major matrices, for proposal adaptation.</summary>
/// <remarks>
/// Written by hand instead of calling MathNet so that the adaptation steps allocate nothing and so that
/// results are a fixed function of the inputs (bit-identical resume).
/// </remarks>
public static class SmallDenseMatrix
{
    /// <summary>
    /// Overwrites the lower triangle of symmetric positive-definite <paramref name="matrix"/> (n×n) with its
    /// Cholesky factor L (A = L Lᵀ) and zeroes the strict upper triangle.
    /// </summary>
    /// <returns><c>false</c> (matrix left partly overwritten) if a pivot is not positive.</returns>
    public static bool CholeskyInPlace(Span<double> matrix, int n)
    {
        for (int j = 0; j < n; j++)
        {
            double diagonal = matrix[j * n + j];
            for (int k = 0; k < j; k++)
            {
                diagonal -= matrix[j * n + k] * matrix[j * n + k];
            }

            if (!(diagonal > 0.0) || !double.IsFinite(diagonal))
            {
                return false;
            }

            double pivot = Math.Sqrt(diagonal);
            matrix[j * n + j] = pivot;
            for (int i = j + 1; i < n; i++)
            {
                double sum = matrix[i * n + j];
                for (int k = 0; k < j; k++)
                {
                    sum -= matrix[i * n + k] * matrix[j * n + k];
                }

                matrix[i * n + j] = sum / pivot;
            }

            for (int i = 0; i < j; i++)
            {
                matrix[i * n + j] = 0.0;
            }
        }

        return true;
    }

    /// <summary>Writes y = L x for lower-triangular L (n×n).</summary>
    public static void LowerTimesVector(ReadOnlySpan<double> lower, int n, ReadOnlySpan<double> x, Span<double> y)
    {
        // Unchecked: indices are bounded by n², and this runs once per proposal.
        unchecked
        {
            for (int i = 0; i < n; i++)
            {
                ReadOnlySpan<double> row = lower.Slice(i * n, i + 1);
                double sum = 0.0;
                for (int k = 0; k < row.Length; k++)
                {
                    sum += row[k] * x[k];
                }

                y[i] = sum;
            }
        }
    }

    /// <summary>
    /// Cyclic Jacobi eigen-decomposition of symmetric <paramref name="matrix"/> (n×n, destroyed). Eigenvalues go
    /// to <paramref name="eigenvalues"/> and the matching unit eigenvectors to the columns of
    /// <paramref name="eigenvectors"/>.
    /// </summary>
    /// <remarks>Golub &amp; Van Loan, Matrix Computations, 4th ed., §8.5 (cyclic Jacobi); quadratic convergence
    /// means ~10 sweeps suffice for the d ≲ 20 matrices this is used on.</remarks>
    public static void SymmetricEigen(Span<double> matrix, int n, Span<double> eigenvalues, Span<double> eigenvectors)
    {
        eigenvectors[..(n * n)].Clear();
        for (int i = 0; i < n; i++)
        {
            eigenvectors[i * n + i] = 1.0;
        }

        const int maxSweeps = 60;
        for (int sweep = 0; sweep < maxSweeps; sweep++)
        {
            double offDiagonal = 0.0;
            double diagonal = 0.0;
            for (int p = 0; p < n; p++)
            {
                diagonal += matrix[p * n + p] * matrix[p * n + p];
                for (int q = p + 1; q < n; q++)
                {
                    offDiagonal += matrix[p * n + q] * matrix[p * n + q];
                }
            }

            if (offDiagonal <= 1e-30 * diagonal || offDiagonal == 0.0)
            {
                break;
            }

            for (int p = 0; p < n - 1; p++)
            {
                for (int q = p + 1; q < n; q++)
                {
                    double apq = matrix[p * n + q];
                    if (apq == 0.0)
                    {
                        continue;
                    }

                    double app = matrix[p * n + p];
                    double aqq = matrix[q * n + q];
                    double theta = (aqq - app) / (2.0 * apq);
                    double t = Math.Sign(theta) / (Math.Abs(theta) + Math.Sqrt(theta * theta + 1.0));
                    if (theta == 0.0)
                    {
                        t = 1.0;
                    }

                    double c = 1.0 / Math.Sqrt(t * t + 1.0);
                    double s = t * c;
                    for (int k = 0; k < n; k++)
                    {
                        double akp = matrix[k * n + p];
                        double akq = matrix[k * n + q];
                        matrix[k * n + p] = c * akp - s * akq;
                        matrix[k * n + q] = s * akp + c * akq;
                    }

                    for (int k = 0; k < n; k++)
                    {
                        double apk = matrix[p * n + k];
                        double aqk = matrix[q * n + k];
                        matrix[p * n + k] = c * apk - s * aqk;
                        matrix[q * n + k] = s * apk + c * aqk;
                    }

                    for (int k = 0; k < n; k++)
                    {
                        double vkp = eigenvectors[k * n + p];
                        double vkq = eigenvectors[k * n + q];
                        eigenvectors[k * n + p] = c * vkp - s * vkq;
                        eigenvectors[k * n + q] = s * vkp + c * vkq;
                    }
                }
            }
        }

        for (int i = 0; i < n; i++)
        {
            eigenvalues[i] = matrix[i * n + i];
        }
    }
}
